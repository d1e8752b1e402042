import { useMutation } from '@tanstack/react-query';
import type { NameChangeInput } from '#shared/schemas/account';
import type { UserDto } from '#shared/schemas/auth';
import { api } from '@/lib/api-client';

export function updateName(input: NameChangeInput): Promise<{ user: UserDto }> {
  return api.patch('/api/me', input);
}

export function useUpdateName() {
  return useMutation({ mutationFn: updateName });
}
