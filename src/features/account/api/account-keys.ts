export const accountKeys = {
  all: ['account'] as const,
  sessions: () => ['account', 'sessions'] as const,
  resetLink: (token: string) => ['account', 'reset-link', token] as const,
};
