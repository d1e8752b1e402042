import type { DisplayUnit } from '#shared/schemas/gardens';
import { formatDegreeDays, formatHeat, formatPercent } from '@/lib/format';

/**
 * Heat toward maturity as a bar with its figures in words: "43 % · 412 of 950 °F-days". Past the
 * target the bar stays full and the words say how far past. Without a target there is no bar.
 */
export function ProgressMeter({
  label,
  accumulated,
  target,
  percent,
  unit,
}: {
  /** The bar's accessible name, e.g. "Heat toward maturity of Lettuce: Copperleaf Butterhead". */
  label: string;
  accumulated: number;
  target: number | null;
  percent: number | null;
  unit: DisplayUnit;
}) {
  if (target === null || percent === null) {
    return <span className="text-sm">{formatDegreeDays(accumulated, unit)} so far · no target</span>;
  }
  const words = `${formatPercent(percent)} · ${formatHeat(accumulated, target, null, unit)}`;
  const filled = Math.min(100, Math.max(0, percent));
  return (
    <div className="flex min-w-0 flex-col gap-1">
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={Math.round(filled)}
        aria-valuetext={words}
        className="h-2.5 w-full overflow-hidden rounded-full border border-line bg-paper-sunk"
      >
        <div className="h-full bg-leaf" style={{ width: `${filled}%` }} />
      </div>
      <span className="text-sm tabular-nums">{words}</span>
    </div>
  );
}
