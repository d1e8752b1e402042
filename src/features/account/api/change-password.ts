import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PasswordChangeInput } from '#shared/schemas/account';
import { api } from '@/lib/api-client';
import { accountKeys } from '@/features/account/api/account-keys';

export function changePassword(input: PasswordChangeInput): Promise<{ status: 'password-changed'; message: string; endedSessions: number }> {
  return api.post('/api/me/password', input);
}

/** The other devices are signed out by the change, so the list of devices is read again. */
export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: changePassword, onSuccess: () => queryClient.invalidateQueries({ queryKey: accountKeys.sessions() }) });
}
