export const invitationKeys = {
  all: (gardenId: number) => ['invitations', gardenId] as const,
  list: (gardenId: number) => ['invitations', gardenId, 'list'] as const,
  testMail: (gardenId: number, invitationId: number) => ['invitations', gardenId, 'test-mail', invitationId] as const,
  /** The page a link opens: not tied to a garden the reader is in. */
  preview: (token: string) => ['invitations', 'preview', token] as const,
};
