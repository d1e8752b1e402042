import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { authKeys } from '@/features/auth/api/auth-keys';
import { clearOfflineData } from '@/lib/offline-queue';

export async function logout(): Promise<void> {
  try {
    await api.post<void>('/api/auth/logout');
  } catch (error) {
    // An already-expired session is the outcome the grower asked for.
    if (!isApiError(error, 401)) throw error;
  }
}

export function useLogout() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onSuccess: async () => {
      // The service worker's copies and the entries waiting to send go too (a shared device).
      await clearOfflineData().catch(() => undefined);
      // Drop every cached record so nothing of this account stays in memory on a shared computer.
      queryClient.removeQueries();
      queryClient.setQueryData(authKeys.me(), null);
    },
  });
}
