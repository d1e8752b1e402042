import { useMutation } from '@tanstack/react-query';
import type { PasswordResetInput } from '#shared/schemas/account';
import { api } from '@/lib/api-client';

export function resetPassword(token: string, input: PasswordResetInput): Promise<{ status: 'password-changed'; message: string }> {
  return api.post(`/api/auth/password-reset/${encodeURIComponent(token)}`, input);
}

export function useResetPassword(token: string) {
  return useMutation({ mutationFn: (input: PasswordResetInput) => resetPassword(token, input) });
}
