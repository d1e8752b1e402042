import { useMutation } from '@tanstack/react-query';
import type { PasswordResetRequestInput, ResetRequestedDto } from '#shared/schemas/account';
import { api } from '@/lib/api-client';

export function requestPasswordReset(input: PasswordResetRequestInput): Promise<ResetRequestedDto> {
  return api.post('/api/auth/password-reset', input);
}

/** The answer is the same whether or not the address has an account: the e-mail is the difference. */
export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset });
}
