import { useQuery } from '@tanstack/react-query';
import type { CapturedMailDto } from '#shared/schemas/notifications';
import { api, isApiError } from '@/lib/api-client';

/**
 * The sign-up mail to an address as the local test mailbox caught it; null when this server
 * sends real e-mail (the route answers 404), so nothing is shown.
 */
export async function getSignUpMail(email: string, signal?: AbortSignal): Promise<CapturedMailDto[] | null> {
  try {
    return (await api.get<{ messages: CapturedMailDto[] }>(`/api/dev/mail/sign-up?email=${encodeURIComponent(email)}`, signal)).messages;
  } catch (error) {
    if (isApiError(error, 404)) return null;
    throw error;
  }
}

export function useSignUpMail(email: string) {
  return useQuery({
    queryKey: ['auth', 'sign-up-mail', email],
    queryFn: ({ signal }) => getSignUpMail(email, signal),
    retry: false,
    // The message is queued and sent a moment later: look again until it is there.
    refetchInterval: (q) => (q.state.data && q.state.data.length ? false : 1500),
  });
}
