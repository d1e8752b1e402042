import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { accountKeys } from '@/features/account/api/account-keys';

export function endSession(id: string): Promise<void> {
  return api.delete(`/api/me/sessions/${encodeURIComponent(id)}`);
}

export function endOtherSessions(): Promise<{ ended: number }> {
  return api.post('/api/me/sessions/sign-out-others', {});
}

export function useEndSession() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: endSession, onSettled: () => queryClient.invalidateQueries({ queryKey: accountKeys.sessions() }) });
}

export function useEndOtherSessions() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: endOtherSessions, onSettled: () => queryClient.invalidateQueries({ queryKey: accountKeys.sessions() }) });
}
