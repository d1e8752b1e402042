import { Download } from 'lucide-react';
import type { ProgressDto } from '#shared/schemas/progress';
import { degreeDayUnit } from '@/lib/format';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { useProgress } from '@/features/progress/api/get-progress';
import { ProgressChartPanel } from '@/features/progress/components/progress-chart-panel';
import { ProgressSummary } from '@/features/progress/components/progress-summary';

const chartTitle = (p: ProgressDto) =>
  p.status === 'planned'
    ? `Projected degree days from the planned start, in ${degreeDayUnit(p.unit)}`
    : `Degree days since the start, in ${degreeDayUnit(p.unit)}, with the projection`;

/** A planting's progress in heat: the chart, its strip and table, and the same in words. */
export function PlantingProgress({ gardenId, plantingId }: { gardenId: number; plantingId: number }) {
  const progress = useProgress(gardenId, plantingId);
  if (progress.isPending) return <Loading label="Loading progress…" />;
  if (progress.isError) {
    return <LoadProblem error={progress.error} what="progress" onRetry={() => progress.refetch()} retrying={progress.isFetching} />;
  }
  return (
    <div className="flex flex-col gap-4">
      <ProgressChartPanel progress={progress.data} title={chartTitle(progress.data)} />
      <ProgressSummary progress={progress.data} />
      {progress.data.series.length > 0 && (
        <p>
          <a
            href={`/api/gardens/${gardenId}/plantings/${plantingId}/degree-days.csv`}
            download
            className="inline-flex min-h-11 items-center gap-2 rounded-md border border-line bg-paper-raised px-4 font-semibold"
          >
            <Download className="size-5" aria-hidden="true" /> Download day-by-day degree days (CSV)
          </a>
        </p>
      )}
    </div>
  );
}
