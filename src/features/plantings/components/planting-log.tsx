import { Camera, Droplets, Flower2, Leaf, NotebookPen, Scissors, ShoppingBasket } from 'lucide-react';
import { HARVEST_UNIT_WORDS, LOG_KIND_WORDS } from '#shared/schemas/plantings';
import type { LogKind } from '#shared/schemas/plantings';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
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

export function PlantingLog({ gardenId, plantingId }: { gardenId: number; plantingId: number }) {
  const log = usePlantingLog(gardenId, plantingId);
  if (log.isPending) return <Loading label="Loading the log…" />;
  if (log.isError) return <Notice tone="error">{log.error.message}</Notice>;
  if (!log.data.items.length) return <p className="text-loam-soft">Nothing logged yet.</p>;
  return (
    <ol className="flex flex-col divide-y divide-line rounded-lg border border-line bg-paper-raised">
      {log.data.items.map((e) => {
        const Icon = ICONS[e.kind];
        return (
          <li key={e.id} className="flex gap-3 px-4 py-3">
            <Icon className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
            <div className="min-w-0">
              <p>
                <span className="font-semibold">{LOG_KIND_WORDS[e.kind]}</span> · {formatDay(e.entryOn)}
                {e.amount !== null && e.amountUnit && ` · ${e.amount} ${HARVEST_UNIT_WORDS[e.amountUnit]}`}
              </p>
              {e.note && <p className="break-words">{e.note}</p>}
              {e.by && <p className="text-sm text-loam-soft">by {e.by}</p>}
            </div>
          </li>
        );
      })}
    </ol>
  );
}
