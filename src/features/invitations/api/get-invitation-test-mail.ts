import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CapturedMailDto } from '#shared/schemas/notifications';
import { api } from '@/lib/api-client';
import { invitationKeys } from '@/features/invitations/api/invitation-keys';

/** The copy the local test mailbox caught: null until delivered; a 404 when mail goes to real addresses. */
export async function getInvitationTestMail(gardenId: number, invitationId: number, signal?: AbortSignal): Promise<CapturedMailDto | null> {
  return (await api.get<{ message: CapturedMailDto | null }>(`/api/gardens/${gardenId}/invitations/${invitationId}/test-mail`, signal)).message;
}

export const invitationTestMailQueryOptions = (gardenId: number, invitationId: number) =>
  queryOptions({
    queryKey: invitationKeys.testMail(gardenId, invitationId),
    queryFn: ({ signal }) => getInvitationTestMail(gardenId, invitationId, signal),
  });

export function useInvitationTestMail(gardenId: number, invitationId: number, enabled: boolean) {
  return useQuery({ ...invitationTestMailQueryOptions(gardenId, invitationId), enabled });
}
