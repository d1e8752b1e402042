import { queryOptions, useQuery } from '@tanstack/react-query';
import type { InvitationPreviewDto } from '#shared/schemas/invitations';
import { api } from '@/lib/api-client';
import { invitationKeys } from '@/features/invitations/api/invitation-keys';

export function getInvitationPreview(token: string, signal?: AbortSignal): Promise<InvitationPreviewDto> {
  return api.get<InvitationPreviewDto>(`/api/invitations/${encodeURIComponent(token)}`, signal);
}

export const invitationPreviewQueryOptions = (token: string) =>
  queryOptions({
    queryKey: invitationKeys.preview(token),
    queryFn: ({ signal }) => getInvitationPreview(token, signal),
  });

export function useInvitationPreview(token: string) {
  return useQuery(invitationPreviewQueryOptions(token));
}
