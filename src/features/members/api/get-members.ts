import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MemberListDto } from '#shared/schemas/members';
import { api } from '@/lib/api-client';
import { memberKeys } from '@/features/members/api/member-keys';

export function getMembers(gardenId: number, signal?: AbortSignal): Promise<MemberListDto> {
  return api.get<MemberListDto>(`/api/gardens/${gardenId}/members`, signal);
}

export const membersQueryOptions = (gardenId: number) =>
  queryOptions({
    queryKey: memberKeys.list(gardenId),
    queryFn: ({ signal }) => getMembers(gardenId, signal),
  });

export function useMembers(gardenId: number) {
  return useQuery(membersQueryOptions(gardenId));
}
