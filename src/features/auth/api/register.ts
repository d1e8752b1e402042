import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RegisterInput, UserDto } from '#shared/schemas/auth';
import type { GardenDto } from '#shared/schemas/gardens';
import { api } from '@/lib/api-client';
import { authKeys } from '@/features/auth/api/auth-keys';

export function register(input: RegisterInput): Promise<{ user: UserDto; garden: GardenDto }> {
  return api.post('/api/auth/register', input);
}

export function useRegister() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: register,
    onSuccess: ({ user }) => {
      queryClient.removeQueries();
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
