import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import type { PlantingDto, PlantingSort } from '#shared/schemas/plantings';
import { formatReady } from '@/lib/format';
import { BoltRiskLabel } from '@/components/ui/bolt-risk-label';
import { ProgressMeter } from '@/components/ui/progress-meter';
import { CONTROL } from '@/features/plantings/components/field-styles';
import { StatusBadge } from '@/features/plantings/components/status-badge';
import { AttentionFlags } from '@/components/ui/attention-flags';
import { formatFullDate } from '@/lib/format';

export interface SortState {
  sort: PlantingSort;
  order: 'asc' | 'desc';
}

type Order = SortState['order'];

/** `first`: the order a column sorts in when chosen — the most advanced, riskiest or soonest on top. */
const COLUMNS: { key: PlantingSort | null; label: string; first?: Order }[] = [
  { key: 'bed', label: 'Bed' },
  { key: 'crop', label: 'Crop' },
  { key: 'variety', label: 'Variety' },
  { key: 'sown', label: 'Sown' },
  { key: 'status', label: 'Status' },
  { key: 'progress', label: 'Progress', first: 'desc' },
  { key: 'ready', label: 'Ready', first: 'asc' },
  { key: 'risk', label: 'Bolt risk', first: 'desc' },
  { key: null, label: 'Next event' },
];

const flip = (order: Order): Order => (order === 'asc' ? 'desc' : 'asc');

function SortButton({ column, label, first = 'asc', state, onSort }: { column: PlantingSort; label: string; first?: Order; state: SortState; onSort: (s: SortState) => void }) {
  const active = state.sort === column;
  const Icon = !active ? ArrowUpDown : state.order === 'asc' ? ArrowUp : ArrowDown;
  return (
    <button
      type="button"
      className="inline-flex min-h-11 items-center gap-1 text-left font-semibold"
      onClick={() => onSort({ sort: column, order: active ? flip(state.order) : first })}
    >
      {label}
      <Icon className="size-4" aria-hidden="true" />
      <span className="sr-only">{active ? (state.order === 'asc' ? ', sorted ascending' : ', sorted descending') : ', sort'}</span>
    </button>
  );
}

const NONE = <span className="text-loam-soft">—</span>;

function NextEvent({ p }: { p: PlantingDto }) {
  if (!p.nextEvent) return NONE;
  return (
    <span>
      {p.nextEvent.label}
      {p.nextEvent.on ? ` ${formatFullDate(p.nextEvent.on)}` : ''}
    </span>
  );
}

/** The progress columns' cells, shared by the wide table and the phone cards; figures in the unit the server computed them in. */
function progressCells(p: PlantingDto) {
  const g = p.progress;
  if (!g) return { progress: NONE, ready: NONE, risk: NONE };
  return {
    progress: (
      <ProgressMeter label={`Heat toward maturity of ${p.crop.name}: ${p.variety.name}`} accumulated={g.accumulated} target={g.target} percent={g.percent} unit={g.unit} />
    ),
    ready: <span>{formatReady(g.maturity)}</span>,
    risk: <BoltRiskLabel level={g.boltLevel} highFrom={g.boltHighFrom} />,
  };
}

const started = (p: PlantingDto) => (p.sownOn ? formatFullDate(p.sownOn) : p.transplantedOn ? `${formatFullDate(p.transplantedOn)} (transplanted)` : '—');

interface RowProps {
  p: PlantingDto;
  href: string;
}

function PlantingRow({ p, href }: RowProps) {
  const cells = progressCells(p);
  return (
    <tr className="border-b border-line align-top hover:bg-paper-sunk">
      <td className="px-2 py-2">{p.bed.name}</td>
      <td className="px-2 py-2">{p.crop.name}</td>
      <td className="px-2 py-2">
        <Link to={href} className="font-semibold underline">
          {p.variety.name}
        </Link>
      </td>
      <td className="px-2 py-2 whitespace-nowrap">{started(p)}</td>
      <td className="px-2 py-2">
        <div className="flex flex-col items-start gap-1">
          <StatusBadge status={p.status} />
          <AttentionFlags attention={p.attention} compact />
        </div>
      </td>
      <td className="min-w-36 px-2 py-2">{cells.progress}</td>
      <td className="px-2 py-2">{cells.ready}</td>
      <td className="px-2 py-2">{cells.risk}</td>
      <td className="px-2 py-2">
        <NextEvent p={p} />
      </td>
    </tr>
  );
}

function PlantingCard({ p, href }: RowProps) {
  const cells = progressCells(p);
  const facts: [string, ReactNode][] = [
    ['Bed', p.bed.name],
    ['Sown', started(p)],
    ['Progress', cells.progress],
    ['Ready', cells.ready],
    ['Bolt risk', cells.risk],
    ['Next', <NextEvent key="next" p={p} />],
  ];
  return (
    <li className="rounded-lg border border-line bg-paper-raised p-3">
      <div className="flex items-start justify-between gap-2">
        <Link to={href} className="font-semibold underline">
          {p.crop.name}: {p.variety.name}
        </Link>
        <StatusBadge status={p.status} />
      </div>
      <div className="mt-1">
        <AttentionFlags attention={p.attention} />
      </div>
      <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1 text-sm">
        {facts.map(([term, value]) => (
          <div key={term} className="contents">
            <dt className="text-loam-soft">{term}</dt>
            <dd className="min-w-0">{value}</dd>
          </div>
        ))}
      </dl>
    </li>
  );
}

/** The cards have no column headers, so a phone sorts with these two selects instead. */
function PhoneSort({ sort, onSort }: { sort: SortState; onSort: (s: SortState) => void }) {
  const sortable = COLUMNS.filter((c): c is { key: PlantingSort; label: string; first?: Order } => c.key !== null);
  return (
    <div className="flex flex-wrap gap-3 lg:hidden">
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Sort by</span>
        <select
          className={CONTROL}
          value={sort.sort}
          onChange={(e) => {
            const column = sortable.find((c) => c.key === e.target.value)!;
            onSort({ sort: column.key, order: column.first ?? 'asc' });
          }}
        >
          {sortable.map((c) => (
            <option key={c.key} value={c.key}>
              {c.label}
            </option>
          ))}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Order</span>
        <select className={CONTROL} value={sort.order} onChange={(e) => onSort({ ...sort, order: e.target.value as Order })}>
          <option value="asc">Ascending</option>
          <option value="desc">Descending</option>
        </select>
      </label>
    </div>
  );
}

/**
 * A table on wide screens; below 64rem each planting becomes a card with the same facts.
 * Progress figures carry the unit the server computed them in.
 */
export function PlantingsTable({
  gardenId,
  plantings,
  sort,
  onSort,
}: {
  gardenId: number;
  plantings: PlantingDto[];
  sort: SortState;
  onSort: (s: SortState) => void;
}) {
  const href = (p: PlantingDto) => `/g/${gardenId}/plantings/${p.id}`;
  return (
    <>
      <table className="hidden w-full border-collapse text-left text-sm lg:table">
        <thead>
          <tr className="border-b-2 border-line">
            {COLUMNS.map((c) => (
              <th
                key={c.label}
                scope="col"
                className="px-2 py-1"
                aria-sort={c.key && sort.sort === c.key ? (sort.order === 'asc' ? 'ascending' : 'descending') : undefined}
              >
                {c.key ? <SortButton column={c.key} label={c.label} first={c.first} state={sort} onSort={onSort} /> : <span className="font-semibold">{c.label}</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {plantings.map((p) => (
            <PlantingRow key={p.id} p={p} href={href(p)} />
          ))}
        </tbody>
      </table>
      <PhoneSort sort={sort} onSort={onSort} />
      <ul className="flex flex-col gap-3 lg:hidden">
        {plantings.map((p) => (
          <PlantingCard key={p.id} p={p} href={href(p)} />
        ))}
      </ul>
    </>
  );
}
