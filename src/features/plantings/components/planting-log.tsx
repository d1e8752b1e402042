import { Camera, Droplets, Flower2, Leaf, NotebookPen, Scissors, ShoppingBasket } from 'lucide-react';
import { HARVEST_UNIT_WORDS, LOG_KIND_WORDS } from '#shared/schemas/plantings';
import type { LogEntryDto, LogKind } from '#shared/schemas/plantings';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { useDeleteLogEntry } from '@/features/plantings/api/delete-log-entry';
import { usePlantingLog } from '@/features/plantings/api/get-planting-log';
import { formatDay } from '@/features/plantings/components/format-day';

const ICONS: Record<LogKind, typeof Leaf> = {
  watered: Droplets,
  fed: Leaf,
  thinned: Scissors,
  observation: NotebookPen,
  harvest: ShoppingBasket,
  bolted: Flower2,
  photo: Camera,
};

function Entry({ gardenId, plantingId, entry: e, canEdit }: { gardenId: number; plantingId: number; entry: LogEntryDto; canEdit: boolean }) {
  const remove = useDeleteLogEntry(gardenId, plantingId, e.id);
  const Icon = ICONS[e.kind];
  const what = `${LOG_KIND_WORDS[e.kind]} · ${formatDay(e.entryOn)}`;
  return (
    <li className="flex flex-wrap gap-3 px-4 py-3">
      <Icon className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
      <div className="min-w-0 flex-1">
        <p>
          <span className="font-semibold">{LOG_KIND_WORDS[e.kind]}</span> · {formatDay(e.entryOn)}
          {e.amount !== null && e.amountUnit && ` · ${e.amount} ${HARVEST_UNIT_WORDS[e.amountUnit]}`}
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

export function PlantingLog({ gardenId, plantingId, canEdit }: { gardenId: number; plantingId: number; canEdit: boolean }) {
  const log = usePlantingLog(gardenId, plantingId);
  if (log.isPending) return <Loading label="Loading the log…" />;
  if (log.isError) return <Notice tone="error">{log.error.message}</Notice>;
  if (!log.data.items.length) return <p className="text-loam-soft">Nothing logged yet.</p>;
  return (
    <ol className="flex flex-col divide-y divide-line rounded-lg border border-line bg-paper-raised">
      {log.data.items.map((e) => (
        <Entry key={e.id} gardenId={gardenId} plantingId={plantingId} entry={e} canEdit={canEdit} />
      ))}
    </ol>
  );
}
