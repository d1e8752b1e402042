import { useMutation } from '@tanstack/react-query';
import type { RegisterInput } from '#shared/schemas/auth';
import { api } from '@/lib/api-client';

/** The server's one answer to every accepted sign-up: the e-mail says what happens next. */
export interface CheckEmailDto {
  status: 'check-email';
  message: string;
}

export function register(input: RegisterInput): Promise<CheckEmailDto> {
  return api.post('/api/auth/register', input);
}

/** Sends the sign-up; nothing is signed in until the link mailed to the address is used. */
export function useRegister() {
  return useMutation({ mutationFn: register });
}
