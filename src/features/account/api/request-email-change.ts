import { useMutation } from '@tanstack/react-query';
import type { EmailChangeInput } from '#shared/schemas/account';
import { api } from '@/lib/api-client';

export function requestEmailChange(input: EmailChangeInput): Promise<{ status: 'check-email'; message: string }> {
  return api.post('/api/me/email-change', input);
}

export function useRequestEmailChange() {
  return useMutation({ mutationFn: requestEmailChange });
}
