import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { invitationKeys } from '@/features/invitations/api/invitation-keys';

export function revokeInvitation(gardenId: number, invitationId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/invitations/${invitationId}`);
}

export function useRevokeInvitation(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: number) => revokeInvitation(gardenId, invitationId),
    onSettled: () => queryClient.invalidateQueries({ queryKey: invitationKeys.all(gardenId) }),
  });
}
