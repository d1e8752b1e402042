import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { InvitationCreateInput, InvitationDto } from '#shared/schemas/invitations';
import { api } from '@/lib/api-client';
import { invitationKeys } from '@/features/invitations/api/invitation-keys';

/** `idempotencyKey` names the one invitation meant: a double tap mails once. */
export async function createInvitation(gardenId: number, input: InvitationCreateInput, idempotencyKey?: string): Promise<InvitationDto> {
  const headers = idempotencyKey ? { 'Idempotency-Key': idempotencyKey } : undefined;
  return (await api.post<{ invitation: InvitationDto }>(`/api/gardens/${gardenId}/invitations`, input, headers)).invitation;
}

export type CreateInvitationVariables = InvitationCreateInput & { idempotencyKey?: string };

export function useCreateInvitation(gardenId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ idempotencyKey, ...input }: CreateInvitationVariables) => createInvitation(gardenId, input, idempotencyKey),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: invitationKeys.all(gardenId) }),
  });
}
