import { useState } from 'react';
import type { ReactNode } from 'react';
import { Trash2 } from 'lucide-react';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';

/**
 * A delete button that first asks, saying what will be lost. When the server refuses because
 * other records still use this one (409), its explanation is shown in words.
 */
export function ConfirmDelete({
  label,
  question,
  consequence,
  confirmLabel = 'Delete',
  onConfirm,
  pending,
  error,
  compact = false,
}: {
  /** The trigger's accessible name, e.g. "Delete bed North 1". */
  label: string;
  question: string;
  consequence: ReactNode;
  confirmLabel?: string;
  onConfirm: () => void;
  pending: boolean;
  error: Error | null;
  /** An icon-only trigger, for rows in a list. */
  compact?: boolean;
}) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button variant="quiet-danger" aria-label={label} title={label} onClick={() => setAsking(true)} className={compact ? 'self-start px-3' : ''}>
        <Trash2 className="size-5" aria-hidden="true" />
        {!compact && 'Delete'}
      </Button>
    );
  }
  return (
    <div role="group" aria-label={question} className="flex basis-full flex-col gap-2 rounded-md border-2 border-clay bg-clay-tint p-3">
      <p className="font-semibold">{question}</p>
      <div className="text-sm">{consequence}</div>
      <div className="flex flex-wrap gap-2">
        <Button variant="danger" onClick={onConfirm} disabled={pending}>
          <Trash2 className="size-5" aria-hidden="true" />
          {pending ? 'Deleting…' : confirmLabel}
        </Button>
        <Button variant="quiet" onClick={() => setAsking(false)} disabled={pending}>
          Keep it
        </Button>
      </div>
      {error && (
        <Notice tone="error" title={isApiError(error, 409) ? 'Still in use, so not deleted' : 'Not deleted'} live="alert">
          {error.message}
        </Notice>
      )}
    </div>
  );
}
