import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CapturedMailDto } from '#shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { notificationKeys } from '@/features/notifications/api/notification-keys';

export async function getMailbox(signal?: AbortSignal): Promise<CapturedMailDto[]> {
  const { messages } = await api.get<{ messages: CapturedMailDto[] }>('/api/dev/mail', signal);
  return messages;
}

export const mailboxQueryOptions = () =>
  queryOptions({ queryKey: notificationKeys.mailbox(), queryFn: ({ signal }) => getMailbox(signal), retry: false });

export function useMailbox() {
  return useQuery(mailboxQueryOptions());
}
