import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { UserDto } from '#shared/schemas/auth';
import type { GardenDto } from '#shared/schemas/gardens';
import { api } from '@/lib/api-client';
import { authKeys } from '@/features/auth/api/auth-keys';

export function confirmRegistration(token: string): Promise<{ user: UserDto; garden: GardenDto }> {
  return api.post(`/api/auth/register/confirm/${encodeURIComponent(token)}`, {});
}

/** Uses the link from the sign-up e-mail: the account and its first garden are created and signed in. */
export function useConfirmRegistration(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => confirmRegistration(token),
    onSuccess: ({ user }) => {
      // Whoever was signed in on this device before, the new account is now.
      queryClient.removeQueries();
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
