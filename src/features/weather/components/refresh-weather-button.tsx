import { LoaderCircle, RefreshCw } from 'lucide-react';
import { isApiError } from '@/lib/api-client';
import { formatDayMonth, formatWait } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useRefreshWeather } from '@/features/weather/api/refresh-weather';
import type { RefreshRun } from '@/features/weather/api/refresh-weather';
import { formatCount } from '@/features/weather/utils/format-weather';

function RunOutcome({ run, through }: { run: RefreshRun; through: string | null }) {
  if (run.cellsFailed > 0) {
    return (
      <Notice tone="error" title="The weather service did not answer" live="alert">
        {run.message ? `${run.message}. ` : ''}Your saved days are unchanged; the nightly refresh will try again.
      </Notice>
    );
  }
  if (run.cellsSkipped > 0 && run.cellsOk === 0) {
    return (
      <Notice tone="info" title="Already up to date" live="status">
        The weather was fetched moments ago, so nothing was asked again. Try in a minute if you expect new readings.
      </Notice>
    );
  }
  // Asked and answered, with nothing new: that is good news, not a failure.
  if (run.daysWritten === 0 && run.daysRejected === 0) {
    return (
      <Notice tone="info" title="Already up to date" live="status">
        {through ? `The saved days already run through ${formatDayMonth(through)}; ` : 'Nothing new was saved; '}
        the weather service had no newer readings.
      </Notice>
    );
  }
  return (
    <Notice tone="success" title="Weather refreshed" live="status">
      {formatCount(run.daysWritten, 'day', 'days')} saved from the weather service.
      {run.daysRejected > 0 &&
        ` ${formatCount(run.daysRejected, 'day looked', 'days looked')} wrong (impossible temperatures) and ${run.daysRejected === 1 ? 'was' : 'were'} left out.`}
    </Notice>
  );
}

/** `through`: the last day of the garden's saved readings, for saying how far they already run. */
export function RefreshWeatherButton({ gardenId, through }: { gardenId: number; through: string | null }) {
  const refresh = useRefreshWeather(gardenId);
  const error = refresh.error;

  return (
    <div className="flex flex-col items-start gap-3">
      <Button variant="quiet" onClick={() => refresh.mutate()} disabled={refresh.isPending}>
        {refresh.isPending ? (
          <LoaderCircle className="size-5 animate-spin motion-reduce:animate-none" aria-hidden="true" />
        ) : (
          <RefreshCw className="size-5" aria-hidden="true" />
        )}
        {refresh.isPending ? 'Refreshing…' : 'Refresh now'}
      </Button>
      {refresh.isSuccess && <RunOutcome run={refresh.data} through={through} />}
      {error && (
        <Notice tone="error" title="The weather could not be refreshed" live="alert">
          {error.message}
          {isApiError(error) && error.retryAfterSeconds !== undefined && ` Try again in ${formatWait(error.retryAfterSeconds)}.`}
        </Notice>
      )}
    </div>
  );
}
