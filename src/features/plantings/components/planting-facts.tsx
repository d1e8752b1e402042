import type { PlantingDto } from '#shared/schemas/plantings';
import { DTM_FROM_WORDS } from '#shared/schemas/varieties';
import type { DtmFrom } from '#shared/schemas/varieties';
import { METHOD_WORDS, PLANTING_UNIT_WORDS, STAGE_FIELDS, STAGE_WORDS } from '#shared/schemas/plantings';
import { StatusBadge } from '@/features/plantings/components/status-badge';
import { AttentionFlags } from '@/components/ui/attention-flags';
import { formatFullDate } from '@/lib/format';

export function PlantingFacts({ planting: p }: { planting: PlantingDto }) {
  const rows: [string, React.ReactNode][] = [
    [
      'Status',
      <div key="s" className="flex flex-col items-start gap-1">
        <StatusBadge status={p.status} />
        <AttentionFlags attention={p.attention} />
      </div>,
    ],
    ['Bed', p.bed.name],
    ['Method', METHOD_WORDS[p.method]],
    ['Quantity', p.quantity === null ? '—' : `${p.quantity} ${PLANTING_UNIT_WORDS[p.quantityUnit]}`],
    ['Seed lot', p.seedLot?.label ?? '—'],
    ['Days to maturity', p.variety.dtmDays === null ? '—' : `${p.variety.dtmDays} days ${DTM_FROM_WORDS[p.variety.dtmFrom as DtmFrom]}`],
    ['Season', p.season ?? '—'],
    ...STAGE_FIELDS.filter((f) => p[f]).map((f): [string, React.ReactNode] => [STAGE_WORDS[f], formatFullDate(p[f]!)]),
    ['Next', p.nextEvent ? `${p.nextEvent.label}${p.nextEvent.on ? ` ${formatFullDate(p.nextEvent.on)}` : ''}` : '—'],
  ];
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-2 rounded-lg border border-line bg-paper-raised p-4">
      {rows.map(([k, v]) => (
        <div key={k} className="contents">
          <dt className="font-semibold">{k}</dt>
          <dd className="min-w-0 break-words">{v}</dd>
        </div>
      ))}
      {p.notes && (
        <div className="contents">
          <dt className="font-semibold">Notes</dt>
          <dd className="break-words">{p.notes}</dd>
        </div>
      )}
    </dl>
  );
}
