import { useMutation } from '@tanstack/react-query';
import type { UserDto } from '#shared/schemas/auth';
import { api } from '@/lib/api-client';

export function confirmEmailChange(token: string): Promise<{ user: UserDto }> {
  return api.post(`/api/me/email-change/${encodeURIComponent(token)}`, {});
}

export function useConfirmEmailChange(token: string) {
  return useMutation({ mutationFn: () => confirmEmailChange(token) });
}
