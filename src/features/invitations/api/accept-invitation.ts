import { useMutation } from '@tanstack/react-query';
import type { UserDto } from '#shared/schemas/auth';
import type { GardenDto } from '#shared/schemas/gardens';
import type { NewAccountAcceptInput } from '#shared/schemas/invitations';
import { api } from '@/lib/api-client';

export interface AcceptedDto {
  user: UserDto;
  garden: GardenDto;
}

/** With a name and password a new account is made and signed in; without, the signed-in user joins. */
export function acceptInvitation(token: string, account: NewAccountAcceptInput | null): Promise<AcceptedDto> {
  return api.post<AcceptedDto>(`/api/invitations/${encodeURIComponent(token)}/accept`, account ?? {});
}

export function useAcceptInvitation(token: string, onAccepted: (done: AcceptedDto) => unknown) {
  return useMutation({ mutationFn: (account: NewAccountAcceptInput | null) => acceptInvitation(token, account), onSuccess: onAccepted });
}
