import { Camera, Droplets, Flower2, Leaf, NotebookPen, Scissors, ShoppingBasket } from 'lucide-react';
import { LOG_KIND_WORDS } from '#shared/schemas/plantings';
import type { LogEntryDto, LogKind } from '#shared/schemas/plantings';
import type { UnitSystem } from '#shared/units/measures';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { useDeleteLogEntry } from '@/features/plantings/api/delete-log-entry';
import { usePlantingLog } from '@/features/plantings/api/get-planting-log';
import { formatFullDate } from '@/lib/format';
import { useQueuedItems } from '@/lib/offline-queue';
import { formatHarvest } from '@/features/plantings/components/format-harvest';

const ICONS: Record<LogKind, typeof Leaf> = {
  watered: Droplets,
  fed: Leaf,
  thinned: Scissors,
  observation: NotebookPen,
  harvest: ShoppingBasket,
  bolted: Flower2,
  photo: Camera,
};

interface EntryProps {
  gardenId: number;
  plantingId: number;
  entry: LogEntryDto;
  canEdit: boolean;
  system: UnitSystem;
}

function Entry({ gardenId, plantingId, entry: e, canEdit, system }: EntryProps) {
  const remove = useDeleteLogEntry(gardenId, plantingId, e.id);
  const Icon = ICONS[e.kind];
  const what = `${LOG_KIND_WORDS[e.kind]} · ${formatFullDate(e.entryOn)}`;
  return (
    <li className="flex flex-wrap gap-3 px-4 py-3">
      <Icon className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
      <div className="min-w-0 flex-1">
        <p>
          <span className="font-semibold">{LOG_KIND_WORDS[e.kind]}</span> · <time dateTime={e.entryOn}>{formatFullDate(e.entryOn)}</time>
          {e.amount !== null && e.amountUnit && ` · ${formatHarvest(e.amount, e.amountUnit, system)}`}
        </p>
        {e.note && <p className="break-words">{e.note}</p>}
        {e.by && <p className="text-sm text-loam-soft">by {e.by}</p>}
      </div>
      {/* A photo's entry goes when its photo is deleted, under Photos. */}
      {canEdit && e.photoId === null && (
        <ConfirmDelete
          compact
          label={`Delete log entry ${what}`}
          question={`Delete “${what}” from the log?`}
          consequence="The entry and its note are removed for good. Dates already set on the planting (such as first harvest) stay as they are; change them with Edit planting."
          confirmLabel="Delete entry"
          onConfirm={() => remove.mutate()}
          pending={remove.isPending}
          error={remove.error}
        />
      )}
    </li>
  );
}

/** The planting's log, newest first; `system` is the garden's (harvest masses are shown in it). */
export function PlantingLog(props: Omit<EntryProps, 'entry'>) {
  return (
    <div className="flex flex-col gap-3">
      <WaitingEntries gardenId={props.gardenId} plantingId={props.plantingId} />
      <SentLog {...props} />
    </div>
  );
}

/** Entries made with no signal, kept on this device until Heatclock has them (src/lib/offline-queue.ts). */
function WaitingEntries({ gardenId, plantingId }: { gardenId: number; plantingId: number }) {
  const items = useQueuedItems().filter((i) => i.gardenId === gardenId && i.plantingId === plantingId && i.kind === 'log');
  if (!items.length) return null;
  return (
    <ol aria-label="Waiting to send" className="flex flex-col divide-y divide-line rounded-lg border border-dashed border-loam-soft bg-paper">
      {items.map((i) => (
        <li key={i.id} className="flex flex-col gap-0.5 px-4 py-3">
          <span className="font-semibold">
            {i.kind === 'log' ? (LOG_KIND_WORDS[i.body.kind as LogKind] ?? i.body.kind) : 'Photo'} · {i.kind === 'log' ? formatFullDate(i.body.entryOn) : ''}
          </span>
          {i.kind === 'log' && i.body.note && <span>{i.body.note}</span>}
          <span className="text-sm text-loam-soft">
            {i.status === 'sending'
              ? 'Sending now…'
              : i.status === 'waiting'
                ? `Waiting to send — saved on this device at ${new Date(i.createdAt).toLocaleTimeString([], { hour: '2-digit', minute: '2-digit' })}`
                : `Not sent: ${i.problem}`}
          </span>
        </li>
      ))}
    </ol>
  );
}

function SentLog({ gardenId, plantingId, canEdit, system }: Omit<EntryProps, 'entry'>) {
  const log = usePlantingLog(gardenId, plantingId);
  if (log.isPending) return <Loading label="Loading the log…" />;
  if (log.isError) return <LoadProblem error={log.error} what="the log" onRetry={() => log.refetch()} retrying={log.isFetching} />;
  if (!log.data.items.length) return <p className="text-loam-soft">Nothing logged yet.</p>;
  return (
    <ol className="flex flex-col divide-y divide-line rounded-lg border border-line bg-paper-raised">
      {log.data.items.map((e) => (
        <Entry key={e.id} gardenId={gardenId} plantingId={plantingId} entry={e} canEdit={canEdit} system={system} />
      ))}
    </ol>
  );
}
