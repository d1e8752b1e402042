import type { ProgressDto } from '#shared/schemas/progress';
import { ChartLegend } from '@/components/ui/chart-legend';
import type { LegendItem } from '@/components/ui/chart-legend';
import { BoltRiskStrip } from '@/features/progress/components/bolt-risk-strip';
import { ProgressTable } from '@/features/progress/components/progress-table';
import { lazyPart } from '@/lib/lazy-part';

// Recharts is large: it loads with this component, in its own chunk, only when a chart is shown.
const ProgressChart = lazyPart(() => import('@/features/progress/components/progress-chart').then((m) => m.ProgressChart), {
  loading: 'Drawing the chart…',
  failed: 'The chart could not be loaded',
});

const LEGEND: LegendItem[] = [
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-leaf" strokeWidth="3" />, words: 'Degree days so far' },
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-leaf" strokeWidth="3" strokeDasharray="3 4" />, words: 'With the forecast' },
  { swatch: <rect x="0" y="1" width="28" height="10" className="fill-leaf-tint" />, words: 'Band: projection, 10th–90th percentile' },
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-loam" strokeWidth="2" strokeDasharray="10 5" />, words: 'Middle estimate' },
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-loam" strokeWidth="2" strokeDasharray="1 4" />, words: 'Dotted: target' },
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-ember" strokeWidth="3" />, words: 'Daily high' },
  { swatch: <line x1="0" y1="6" x2="28" y2="6" className="stroke-frost" strokeWidth="3" />, words: 'Daily low' },
  { swatch: <line x1="14" y1="0" x2="14" y2="12" className="stroke-loam" strokeWidth="2" />, words: 'Vertical line: today' },
];


/** The chart with its legend, the bolt-risk strip and the same figures as a table. */
export function ProgressChartPanel({ progress, title }: { progress: ProgressDto; title: string }) {
  const hasDays = progress.series.length > 0 || progress.projection.length > 0;
  return (
    <figure aria-labelledby="progress-chart-caption" className="flex min-w-0 flex-col gap-3 rounded-lg border border-line bg-paper-raised p-3 sm:p-5">
      <figcaption id="progress-chart-caption" className="font-bold">
        {title}
        <span className="sr-only">. The same figures are in the summary and the table below the chart.</span>
      </figcaption>
      {hasDays ? (
        <div className="min-h-64 w-full min-w-0">
          <ProgressChart progress={progress} />
        </div>
      ) : (
        <p className="text-loam-soft">No days to draw yet: the chart starts once the planting has a start date and weather.</p>
      )}
      {hasDays && <ChartLegend items={LEGEND} className="grid grid-cols-1 gap-x-4 gap-y-1.5 text-sm min-[25rem]:grid-cols-2 sm:flex sm:flex-wrap sm:gap-x-5" />}
      {progress.boltRisk.level !== 'none' && progress.boltRisk.days.length > 0 && <BoltRiskStrip progress={progress} />}
      {hasDays && <ProgressTable progress={progress} />}
    </figure>
  );
}
