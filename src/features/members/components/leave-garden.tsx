import { useState } from 'react';
import { LogOut } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useLeaveGarden } from '@/features/members/api/leave-garden';

/** Anyone may leave, except the garden's only owner, who is told why instead. */
export function LeaveGarden({ gardenId, gardenName, soleOwner, onLeft }: { gardenId: number; gardenName: string; soleOwner: boolean; onLeft: () => unknown }) {
  const [asking, setAsking] = useState(false);
  const leave = useLeaveGarden(gardenId, onLeft);
  if (soleOwner) {
    return (
      <Notice tone="info" title="You are the only owner">
        A garden always needs an owner, so you cannot leave it. Make another member an owner first; then you can leave.
      </Notice>
    );
  }
  if (!asking) {
    return (
      <Button variant="quiet-danger" className="self-start" onClick={() => setAsking(true)}>
        <LogOut className="size-5" aria-hidden="true" />
        Leave this garden
      </Button>
    );
  }
  return (
    <div role="group" aria-label="Leave this garden" className="flex flex-col gap-2 rounded-md border-2 border-clay bg-clay-tint p-3">
      <p className="font-semibold">{`Leave “${gardenName}”?`}</p>
      <p className="text-sm">You will no longer see this garden. An owner can invite you again later.</p>
      <div className="flex flex-wrap gap-2">
        <Button variant="danger" onClick={() => leave.mutate()} disabled={leave.isPending}>
          {leave.isPending ? 'Leaving…' : 'Leave'}
        </Button>
        <Button variant="quiet" onClick={() => { leave.reset(); setAsking(false); }} disabled={leave.isPending}>
          Stay
        </Button>
      </div>
      {leave.error && <Notice tone="error" title="You are still a member" live="alert">{leave.error.message}</Notice>}
    </div>
  );
}
