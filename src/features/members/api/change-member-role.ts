import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Role } from '#shared/schemas/gardens';
import type { MemberDto } from '#shared/schemas/members';
import { api } from '@/lib/api-client';
import { memberKeys } from '@/features/members/api/member-keys';

export async function changeMemberRole(gardenId: number, userId: number, role: Role): Promise<MemberDto> {
  return (await api.patch<{ member: MemberDto }>(`/api/gardens/${gardenId}/members/${userId}`, { role })).member;
}

/** `onChanged` lets the page refresh what depends on the reader's own role (the garden itself). */
export function useChangeMemberRole(gardenId: number, onChanged?: (member: MemberDto) => unknown) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ userId, role }: { userId: number; role: Role }) => changeMemberRole(gardenId, userId, role),
    onSuccess: async (member) => {
      await queryClient.invalidateQueries({ queryKey: memberKeys.all(gardenId) });
      await onChanged?.(member);
    },
  });
}
