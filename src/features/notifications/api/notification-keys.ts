export const notificationKeys = {
  all: ['notifications'] as const,
  preferences: () => ['notifications', 'preferences'] as const,
  unsubscribe: (token: string) => ['notifications', 'unsubscribe', token] as const,
  mailbox: () => ['notifications', 'mailbox'] as const,
  failed: (gardenId: number) => ['notifications', 'failed', gardenId] as const,
};
