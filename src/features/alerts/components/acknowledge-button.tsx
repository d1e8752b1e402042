import { useRef } from 'react';
import { Check, CircleAlert } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { useAcknowledgeAlert } from '@/features/alerts/api/acknowledge-alert';

/** Marks an open alert as seen; it stays listed, under Acknowledged, until its condition passes. */
export function AcknowledgeButton({ gardenId, alertId, title }: { gardenId: number; alertId: number; title: string }) {
  const acknowledge = useAcknowledgeAlert(gardenId);
  const submission = useSubmissionKey();
  // Set at once on the tap: the mutation's own pending state reaches the button a moment later.
  const sending = useRef(false);
  const tap = () => {
    if (sending.current) return;
    sending.current = true;
    acknowledge.mutate(
      { alertId, idempotencyKey: submission.keyFor(alertId) },
      {
        onSettled: () => {
          sending.current = false;
        },
      },
    );
  };
  return (
    <div className="flex flex-col items-start gap-1">
      <Button variant="quiet" disabled={acknowledge.isPending} onClick={tap}>
        <Check className="size-5" aria-hidden="true" />
        {acknowledge.isPending ? 'Acknowledging…' : 'Acknowledge'}
        <span className="sr-only">: {title}</span>
      </Button>
      {acknowledge.isError && (
        <p role="alert" className="flex items-center gap-1 text-sm text-clay">
          <CircleAlert className="size-4 shrink-0" aria-hidden="true" />
          Not acknowledged: {acknowledge.error.message}
        </p>
      )}
    </div>
  );
}
