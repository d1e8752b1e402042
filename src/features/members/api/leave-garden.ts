import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';

export function leaveGarden(gardenId: number): Promise<void> {
  return api.delete(`/api/gardens/${gardenId}/members/me`);
}

/** The page decides where to go and what to forget once the garden is no longer the reader's. */
export function useLeaveGarden(gardenId: number, onLeft: () => unknown) {
  return useMutation({ mutationFn: () => leaveGarden(gardenId), onSuccess: onLeft });
}
