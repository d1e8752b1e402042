import { useEffect, useState } from 'react';
import { CloudOff, Copy, RotateCw, Trash2, UploadCloud } from 'lucide-react';
import { LOG_KIND_WORDS } from '#shared/schemas/plantings';
import type { LogKind } from '#shared/schemas/plantings';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { formatFullDate } from '@/lib/format';
import { newSubmissionKey } from '@/lib/use-submission-key';
import { discardQueued, resend, retarget, setQueueOwner, useQueuedItems } from '@/lib/offline-queue';
import type { QueuedItem } from '@/lib/offline-queue';
import { useOfflineSync } from '@/features/offline/use-offline-sync';
import { useOnline } from '@/features/offline/use-online';
import { usePlantingChoices } from '@/features/offline/api/get-planting-choices';

const entryWords = (n: number) => `${n} ${n === 1 ? 'entry' : 'entries'}`;

function describe(item: QueuedItem): string {
  if (item.kind === 'photo') return `Photo${item.caption ? ` “${item.caption}”` : ''} of ${formatFullDate(item.takenOn)} for ${item.plantingName}`;
  const note = item.body.note ? ` — “${item.body.note}”` : '';
  // The amount is kept in what was sent (kilograms for a weight, or a count).
  const amount = item.body.amount !== null && item.body.amountUnit ? `, ${item.body.amount} ${item.body.amountUnit === 'count' ? 'pieces' : item.body.amountUnit}` : '';
  return `${LOG_KIND_WORDS[item.body.kind as LogKind] ?? item.body.kind}${amount} on ${formatFullDate(item.body.entryOn)} for ${item.plantingName}${note}`;
}

function KeptEntry({ item }: { item: QueuedItem }) {
  const [choosing, setChoosing] = useState(false);
  const [copied, setCopied] = useState(false);
  const choices = usePlantingChoices(item.gardenId, choosing);
  const others = choices.data?.items.filter((p) => p.id !== item.plantingId) ?? [];
  const copy = () =>
    void navigator.clipboard?.writeText(describe(item)).then(
      () => setCopied(true),
      () => setCopied(false),
    );
  return (
    <li className="flex flex-col gap-2">
      <Notice tone="error" title={item.status === 'conflict' ? 'Entry not sent: its planting is gone' : 'Entry not sent'}>
        <p>{item.problem}</p>
        <p className="text-sm">Your entry: {describe(item)}</p>
      </Notice>
      <div className="flex flex-wrap items-center gap-2">
        {item.kind === 'log' && (
          <Button variant="quiet" onClick={copy}>
            <Copy className="size-4" aria-hidden="true" />
            {copied ? 'Copied' : 'Copy it'}
          </Button>
        )}
        {choosing ? (
          <label className="flex items-center gap-2 text-sm">
            <span className="font-semibold">Send it to</span>
            <select
              defaultValue=""
              aria-busy={choices.isPending}
              onChange={(e) => {
                const to = others.find((p) => p.id === Number(e.target.value));
                if (to) void retarget(item.id, to.id, `${to.variety.name} in ${to.bed.name}`, newSubmissionKey());
              }}
              className="rounded-md border border-line bg-paper px-2 py-2"
            >
              <option value="" disabled>
                {choices.isPending ? 'Loading plantings…' : choices.isError ? 'Plantings could not load' : 'Choose a planting'}
              </option>
              {others.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.variety.name} in {p.bed.name}
                </option>
              ))}
            </select>
          </label>
        ) : (
          <Button variant="quiet" onClick={() => setChoosing(true)}>
            <UploadCloud className="size-4" aria-hidden="true" />
            Choose another planting
          </Button>
        )}
        {item.status === 'failed' && (
          <Button variant="quiet" onClick={() => void resend(item.id)}>
            <RotateCw className="size-4" aria-hidden="true" />
            Send again
          </Button>
        )}
        <Button variant="quiet" onClick={() => void discardQueued(item.id)}>
          <Trash2 className="size-4" aria-hidden="true" />
          Discard it
        </Button>
      </div>
    </li>
  );
}

/** In the garden frame: whether Heatclock is reachable, what waits to be sent, and what could not be. */
export function OfflineStatus({ userId }: { userId: number | null }) {
  // Entries belong to the account that made them: only its session sends or shows them.
  useEffect(() => {
    void setQueueOwner(userId);
  }, [userId]);
  useOfflineSync();
  const online = useOnline();
  const items = useQueuedItems();
  const waiting = items.filter((i) => i.status === 'waiting' || i.status === 'sending').length;
  const kept = items.filter((i) => i.status === 'conflict' || i.status === 'failed');
  if (online && !waiting && !kept.length) return null;
  return (
    <div className="mx-auto flex max-w-5xl flex-col gap-2 px-4 pt-3">
      {(!online || waiting > 0) && (
        <p role="status" className="flex items-center gap-2 rounded-md border border-line bg-paper-sunk px-3 py-2 text-sm font-semibold">
          <CloudOff className="size-4 shrink-0" aria-hidden="true" />
          {!online && 'Offline — showing what you last saw.'}
          {!online && waiting > 0 && ' '}
          {waiting > 0 && `${entryWords(waiting)} waiting to send.`}
        </p>
      )}
      {kept.length > 0 && (
        <ul className="flex flex-col gap-3">
          {kept.map((item) => (
            <KeptEntry key={item.id} item={item} />
          ))}
        </ul>
      )}
    </div>
  );
}
