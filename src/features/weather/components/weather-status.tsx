import { CircleCheck, CircleDashed, Clock, LoaderCircle, TriangleAlert } from 'lucide-react';
import type { WeatherResponse } from '#shared/schemas/weather';
import { RefreshWeatherButton } from '@/features/weather/components/refresh-weather-button';
import { formatCount } from '@/features/weather/utils/format-weather';
import { formatFullDate, formatInstant } from '@/lib/format';

type History = NonNullable<WeatherResponse['history']>;

function HistoryProgress({ history, today }: { history: History; today: string }) {
  const years = formatCount(Number(today.slice(0, 4)) - Number(history.targetFrom.slice(0, 4)), 'year', 'years');
  if (history.complete) {
    return (
      <p className="flex items-start gap-2">
        <CircleCheck className="mt-0.5 size-5 shrink-0 text-leaf" aria-hidden="true" />
        <span>
          Weather history: complete, {years} back to {formatFullDate(history.historyFrom ?? history.targetFrom)}.
        </span>
      </p>
    );
  }
  const Icon = history.running ? LoaderCircle : history.error ? TriangleAlert : CircleDashed;
  return (
    <div className="flex flex-col gap-2">
      <p className="flex items-start gap-2">
        <Icon
          className={`mt-0.5 size-5 shrink-0 ${history.running ? 'animate-spin motion-reduce:animate-none' : ''} ${history.error ? 'text-clay' : 'text-loam-soft'}`}
          aria-hidden="true"
        />
        <span>
          Weather history: {history.percent} % of {years} fetched
          {history.running ? '…' : history.error ? ', then it stopped.' : '; the rest follows at the next refresh.'}
        </span>
      </p>
      <div
        role="progressbar"
        aria-label="Weather history fetched"
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={history.percent}
        aria-valuetext={`${history.percent} %`}
        className="h-2.5 w-full max-w-sm overflow-hidden rounded-full border border-line bg-paper-sunk"
      >
        <div className="h-full bg-leaf" style={{ width: `${history.percent}%` }} />
      </div>
      {history.error && (
        <p className="text-sm text-loam-soft">
          {history.error.replace(/\.$/, '')}. It resumes at the next nightly refresh or when someone presses “Refresh now”.
        </p>
      )}
      <p className="text-sm text-loam-soft">
        Past seasons let Heatclock compare this year with earlier ones. The days below are ready to use meanwhile.
      </p>
    </div>
  );
}

export function WeatherStatus({
  weather,
  history,
  gardenId,
  timeZone,
  canRefresh,
}: {
  weather: WeatherResponse;
  history: History;
  gardenId: number;
  timeZone: string;
  canRefresh: boolean;
}) {
  return (
    <section aria-labelledby="weather-status-heading" className="flex flex-col gap-3 rounded-lg border border-line bg-paper-raised p-4 sm:p-5">
      <h2 id="weather-status-heading" className="text-lg font-bold">
        From the weather service
      </h2>
      <HistoryProgress history={history} today={weather.today} />
      <p className="flex items-start gap-2">
        <Clock className="mt-0.5 size-5 shrink-0 text-loam-soft" aria-hidden="true" />
        <span>
          {history.refreshedAt
            ? `Last fetched: ${formatInstant(history.refreshedAt, timeZone)} (garden time, ${timeZone}). New readings are fetched every night.`
            : 'Not fetched yet. New readings are fetched every night.'}
        </span>
      </p>
      {canRefresh && <RefreshWeatherButton gardenId={gardenId} through={history.historyThrough} />}
    </section>
  );
}
