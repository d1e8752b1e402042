import { Hourglass, NotebookPen } from 'lucide-react';
import type { AttentionDto } from '#shared/plantings/attention';
import { countOf } from '#shared/format/count-words';
import { formatDayMonth } from '@/lib/format';

/** "Harvest overdue" / "No record for 4 weeks" in words and icons, beside the status (never colour alone). */
export function attentionWords(a: AttentionDto): { key: 'overdue' | 'stale'; title: string; detail: string }[] {
  const out: { key: 'overdue' | 'stale'; title: string; detail: string }[] = [];
  if (a.overdue) out.push({ key: 'overdue', title: 'Harvest overdue', detail: `expected by ${formatDayMonth(a.overdue.due)}, ${countOf(a.overdue.days, 'day')} ago, and no harvest logged` });
  if (a.stale) {
    const weeks = Math.floor(a.stale.days / 7);
    out.push({ key: 'stale', title: `Nothing logged for ${countOf(weeks, 'week')}`, detail: a.stale.lastOn ? `last record ${formatDayMonth(a.stale.lastOn)}` : 'no record yet' });
  }
  return out;
}

export function AttentionFlags({ attention, compact = false }: { attention: AttentionDto | undefined; compact?: boolean }) {
  if (!attention) return null;
  const flags = attentionWords(attention);
  if (!flags.length) return null;
  return (
    <ul className="flex flex-col gap-1 text-sm">
      {flags.map((f) => {
        const Icon = f.key === 'overdue' ? Hourglass : NotebookPen;
        return (
          <li key={f.key} className="inline-flex items-start gap-1">
            <Icon className={`mt-0.5 size-4 shrink-0 ${f.key === 'overdue' ? 'text-ember' : 'text-loam-soft'}`} aria-hidden="true" />
            <span>
              <span className="font-semibold">{f.title}</span>
              {compact ? <span className="sr-only">: {f.detail}</span> : <span className="text-loam-soft">: {f.detail}</span>}
            </span>
          </li>
        );
      })}
    </ul>
  );
}
