import { Link } from 'react-router-dom';
import { ArrowDown, ArrowUp, ArrowUpDown } from 'lucide-react';
import type { PlantingDto, PlantingSort } from '#shared/schemas/plantings';
import { StatusBadge } from '@/features/plantings/components/status-badge';
import { formatDay } from '@/features/plantings/components/format-day';

export interface SortState {
  sort: PlantingSort;
  order: 'asc' | 'desc';
}

const COLUMNS: { key: PlantingSort | null; label: string }[] = [
  { key: 'bed', label: 'Bed' },
  { key: 'crop', label: 'Crop' },
  { key: 'variety', label: 'Variety' },
  { key: 'sown', label: 'Sown' },
  { key: 'status', label: 'Status' },
  { key: null, label: 'Next event' },
];

function SortButton({ column, label, state, onSort }: { column: PlantingSort; label: string; state: SortState; onSort: (s: SortState) => void }) {
  const active = state.sort === column;
  const Icon = !active ? ArrowUpDown : state.order === 'asc' ? ArrowUp : ArrowDown;
  return (
    <button
      type="button"
      className="inline-flex min-h-11 items-center gap-1 font-semibold"
      onClick={() => onSort({ sort: column, order: active && state.order === 'asc' ? 'desc' : 'asc' })}
    >
      {label}
      <Icon className="size-4" aria-hidden="true" />
      <span className="sr-only">{active ? (state.order === 'asc' ? ', sorted ascending' : ', sorted descending') : ', sort'}</span>
    </button>
  );
}

function NextEvent({ p }: { p: PlantingDto }) {
  if (!p.nextEvent) return <span className="text-loam-soft">—</span>;
  return (
    <span title={p.nextEvent.basis}>
      {p.nextEvent.label}
      {p.nextEvent.on ? ` ${formatDay(p.nextEvent.on)}` : ''}
    </span>
  );
}

/** A table on wide screens; on a phone each planting becomes a card with the same facts. */
export function PlantingsTable({ gardenId, plantings, sort, onSort }: { gardenId: number; plantings: PlantingDto[]; sort: SortState; onSort: (s: SortState) => void }) {
  const href = (p: PlantingDto) => `/g/${gardenId}/plantings/${p.id}`;
  return (
    <>
      <table className="hidden w-full border-collapse text-left md:table">
        <thead>
          <tr className="border-b-2 border-line">
            {COLUMNS.map((c) => (
              <th
                key={c.label}
                scope="col"
                className="px-2 py-1"
                aria-sort={c.key && sort.sort === c.key ? (sort.order === 'asc' ? 'ascending' : 'descending') : undefined}
              >
                {c.key ? <SortButton column={c.key} label={c.label} state={sort} onSort={onSort} /> : <span className="font-semibold">{c.label}</span>}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {plantings.map((p) => (
            <tr key={p.id} className="border-b border-line align-top hover:bg-paper-sunk">
              <td className="px-2 py-2">{p.bed.name}</td>
              <td className="px-2 py-2">{p.crop.name}</td>
              <td className="px-2 py-2">
                <Link to={href(p)} className="font-semibold underline">
                  {p.variety.name}
                </Link>
              </td>
              <td className="px-2 py-2 whitespace-nowrap">{p.sownOn ? formatDay(p.sownOn) : p.transplantedOn ? `${formatDay(p.transplantedOn)} (transplanted)` : '—'}</td>
              <td className="px-2 py-2">
                <StatusBadge status={p.status} />
              </td>
              <td className="px-2 py-2">
                <NextEvent p={p} />
              </td>
            </tr>
          ))}
        </tbody>
      </table>
      <ul className="flex flex-col gap-3 md:hidden">
        {plantings.map((p) => (
          <li key={p.id} className="rounded-lg border border-line bg-paper-raised p-3">
            <div className="flex items-start justify-between gap-2">
              <Link to={href(p)} className="font-semibold underline">
                {p.crop.name}: {p.variety.name}
              </Link>
              <StatusBadge status={p.status} />
            </div>
            <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
              <dt className="text-loam-soft">Bed</dt>
              <dd>{p.bed.name}</dd>
              <dt className="text-loam-soft">Sown</dt>
              <dd>{p.sownOn ? formatDay(p.sownOn) : p.transplantedOn ? `${formatDay(p.transplantedOn)} (transplanted)` : '—'}</dd>
              <dt className="text-loam-soft">Next</dt>
              <dd>
                <NextEvent p={p} />
              </dd>
            </dl>
          </li>
        ))}
      </ul>
    </>
  );
}
