import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { LoginInput, UserDto } from '#shared/schemas/auth';
import { api } from '@/lib/api-client';
import { authKeys } from '@/features/auth/api/auth-keys';

export function login(input: LoginInput): Promise<{ user: UserDto }> {
  return api.post('/api/auth/login', input);
}

export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    onSuccess: ({ user }) => {
      // Whatever was cached belonged to the previous session.
      queryClient.removeQueries();
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}
