import { CalendarClock, CircleCheck, Flower2, Sprout, XCircle } from 'lucide-react';
import { STATUS_WORDS } from '#shared/schemas/plantings';
import type { PlantingStatus } from '#shared/schemas/plantings';

// Each status has a word and an icon; the colour only repeats what they say.
const LOOK: Record<PlantingStatus, { icon: typeof Sprout; className: string }> = {
  planned: { icon: CalendarClock, className: 'border-line bg-paper-sunk text-loam' },
  growing: { icon: Sprout, className: 'border-leaf bg-leaf-tint text-leaf' },
  harvested: { icon: CircleCheck, className: 'border-frost bg-frost-tint text-frost' },
  bolted: { icon: Flower2, className: 'border-ember bg-ember-tint text-ember' },
  failed: { icon: XCircle, className: 'border-clay bg-clay-tint text-clay' },
};

export function StatusBadge({ status }: { status: PlantingStatus }) {
  const { icon: Icon, className } = LOOK[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold whitespace-nowrap ${className}`}>
      <Icon className="size-4" aria-hidden="true" />
      {STATUS_WORDS[status]}
    </span>
  );
}
