import { Minus, OctagonAlert, ShieldCheck, TriangleAlert } from 'lucide-react';
import type { BoltLevelOrNone } from '#shared/schemas/progress';
import { BOLT_WORDS, formatDayMonth } from '@/lib/format';

// Each level has a word and an icon; the colour only repeats what they say.
export const BOLT_LOOK: Record<BoltLevelOrNone, { icon: typeof Minus; className: string }> = {
  none: { icon: Minus, className: 'border-line bg-paper-raised text-loam-soft' },
  low: { icon: ShieldCheck, className: 'border-line bg-paper-sunk text-loam' },
  elevated: { icon: TriangleAlert, className: 'border-ember bg-paper-raised text-ember' },
  high: { icon: OctagonAlert, className: 'border-ember bg-ember-tint text-ember' },
};

/** "Elevated, high from 9 Jun" with its icon; `prefix` names it where the context does not ("Bolt risk: "). */
export function BoltRiskLabel({ level, highFrom = null, prefix = '' }: { level: BoltLevelOrNone; highFrom?: string | null; prefix?: string }) {
  const { icon: Icon, className } = BOLT_LOOK[level];
  // A high level already in force reads as "High"; a coming one says when it starts.
  const coming = highFrom && (level === 'low' || level === 'elevated') ? `, high from ${formatDayMonth(highFrom)}` : '';
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border px-2 py-0.5 text-sm font-semibold ${className}`}>
      <Icon className="size-4 shrink-0" aria-hidden="true" />
      {prefix}
      {BOLT_WORDS[level]}
      {coming}
    </span>
  );
}
