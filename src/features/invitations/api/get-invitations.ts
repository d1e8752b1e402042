import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationListDto } from '#shared/schemas/invitations';
import { api } from '@/lib/api-client';
import { invitationKeys } from '@/features/invitations/api/invitation-keys';

export function getInvitations(gardenId: number, signal?: AbortSignal): Promise<InvitationListDto> {
  return api.get<InvitationListDto>(`/api/gardens/${gardenId}/invitations`, signal);
}

export const invitationsQueryOptions = (gardenId: number) =>
  queryOptions({
    queryKey: invitationKeys.list(gardenId),
    queryFn: ({ signal }) => getInvitations(gardenId, signal),
  });

/** Owners only: the server refuses everyone else. */
export function useInvitations(gardenId: number, enabled: boolean) {
  return useQuery({ ...invitationsQueryOptions(gardenId), enabled });
}
