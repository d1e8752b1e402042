import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { memberKeys } from '@/features/members/api/member-keys';

export function removeMember(gardenId: number, userId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/members/${userId}`);
}

export function useRemoveMember(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (userId: number) => removeMember(gardenId, userId),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: memberKeys.all(gardenId) }),
  });
}
