import { CircleCheck, CircleX, LoaderCircle, TriangleAlert } from 'lucide-react';
import type { JobRunDto } from '#shared/schemas/weather';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { useWeatherRuns } from '@/features/weather/api/get-weather-runs';
import { formatDuration } from '@/features/weather/utils/format-weather';
import { formatInstant } from '@/lib/format';

const STATUS: Record<string, { words: string; icon: typeof CircleCheck; tone: string; spin?: boolean }> = {
  running: { words: 'Running', icon: LoaderCircle, tone: 'text-loam-soft', spin: true },
  ok: { words: 'Done', icon: CircleCheck, tone: 'text-leaf' },
  partial: { words: 'Partly done', icon: TriangleAlert, tone: 'text-clay' },
  failed: { words: 'Failed', icon: CircleX, tone: 'text-clay' },
};

const KIND_WORDS: Record<string, string> = { nightly: 'Nightly', manual: 'Refresh now' };

function RunStatus({ status }: { status: string }) {
  const s = STATUS[status] ?? { words: status, icon: TriangleAlert, tone: 'text-loam-soft' };
  const Icon = s.icon;
  return (
    <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
      <Icon className={`size-4 shrink-0 ${s.tone} ${s.spin ? 'animate-spin motion-reduce:animate-none' : ''}`} aria-hidden="true" />
      {s.words}
    </span>
  );
}

function runNote(run: JobRunDto): string {
  if (run.message) return run.message;
  const notes: string[] = [];
  if (run.cellsFailed > 0) notes.push(`${run.cellsFailed} of ${run.cellsOk + run.cellsFailed} weather areas could not be fetched`);
  if (run.cellsSkipped > 0 && run.cellsOk === 0 && run.cellsFailed === 0) notes.push('Already up to date; nothing asked');
  if (run.daysRejected > 0) notes.push(`${run.daysRejected} implausible days left out`);
  return notes.join('; ');
}

const CELL = 'px-3 py-2 text-left align-top';
const HEAD = `${CELL} whitespace-nowrap`;

export function WeatherRunsTable({ gardenId, timeZone }: { gardenId: number; timeZone: string }) {
  const runs = useWeatherRuns(gardenId);

  return (
    <section aria-labelledby="weather-runs-heading" className="flex flex-col gap-3">
      <div>
        <h2 id="weather-runs-heading" className="text-lg font-bold">
          Weather fetches
        </h2>
        <p className="text-sm text-loam-soft">
          Owners only. The last 20 times Heatclock asked the weather service for this garden’s days, in garden time (
          {timeZone}). Gardens close together share one weather area, so one fetch serves them all.
        </p>
        <p className="text-sm text-loam-soft sm:hidden">Scroll the table sideways for more columns.</p>
      </div>
      {runs.isPending && <Loading label="Loading the fetch history…" />}
      {runs.isError && (
        <LoadProblem error={runs.error} what="the fetch history" onRetry={() => runs.refetch()} retrying={runs.isFetching} />
      )}
      {runs.isSuccess && runs.data.length === 0 && <p>No fetches yet.</p>}
      {runs.isSuccess && runs.data.length > 0 && (
        <div className="overflow-x-auto rounded-lg border border-line bg-paper-raised" tabIndex={0} role="region" aria-labelledby="weather-runs-heading">
          <table className="w-full min-w-[40rem] border-collapse text-sm">
            <thead>
              <tr className="border-b border-line">
                <th scope="col" className={HEAD}>Started</th>
                <th scope="col" className={HEAD}>Kind</th>
                <th scope="col" className={HEAD}>Result</th>
                <th scope="col" className={`${HEAD} text-right`}>Days saved</th>
                <th scope="col" className={`${HEAD} text-right`}>Took</th>
                <th scope="col" className={HEAD}>Note</th>
              </tr>
            </thead>
            <tbody>
              {runs.data.map((run) => (
                <tr key={run.id} className="border-b border-line/60 last:border-b-0">
                  <td className={`${CELL} whitespace-nowrap`}>{formatInstant(run.startedAt, timeZone)}</td>
                  <td className={`${CELL} whitespace-nowrap`}>{KIND_WORDS[run.kind] ?? run.kind}</td>
                  <td className={CELL}>
                    <RunStatus status={run.status} />
                  </td>
                  <td className={`${CELL} text-right tabular-nums`}>{run.daysWritten}</td>
                  <td className={`${CELL} text-right whitespace-nowrap tabular-nums`}>
                    {run.finishedAt ? formatDuration(Date.parse(run.finishedAt) - Date.parse(run.startedAt)) : '—'}
                  </td>
                  <td className={`${CELL} min-w-56 text-loam-soft`}>{runNote(run)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </section>
  );
}
