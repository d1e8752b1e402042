import { Link } from 'react-router-dom';
import { Settings } from 'lucide-react';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { useWeather } from '@/features/weather/api/get-weather';
import { StationUploadForm } from '@/features/weather/components/station-upload-form';
import { WeatherChartPanel } from '@/features/weather/components/weather-chart-panel';
import { WeatherRunsTable } from '@/features/weather/components/weather-runs-table';
import { WeatherStatus } from '@/features/weather/components/weather-status';
import { WeatherTable } from '@/features/weather/components/weather-table';
import { formatFullRange } from '@/lib/format';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';

export function WeatherPage() {
  const garden = useCurrentGarden();
  const weather = useWeather(garden.id);
  const canEdit = garden.role !== 'viewer';

  return (
    <div className="flex flex-col gap-6">
      <title>{`Weather · ${garden.name} · Heatclock`}</title>
      <div className="flex flex-col gap-1">
        <h1 className="text-2xl font-bold sm:text-3xl">Weather</h1>
        <p className="text-loam-soft">
          Daily highs and lows for {garden.name}: the last 30 days and the forecast ahead, in °{garden.units}.
        </p>
      </div>

      {weather.isPending && <Loading label="Loading the weather…" />}
      {weather.isError && (
        <LoadProblem error={weather.error} what="the weather" onRetry={() => weather.refetch()} retrying={weather.isFetching} />
      )}
      {weather.isSuccess && (
        <>
          {weather.data.history ? (
            <WeatherStatus
              weather={weather.data}
              history={weather.data.history}
              gardenId={garden.id}
              timeZone={garden.timeZone}
              canRefresh={canEdit}
            />
          ) : (
            <Notice tone="info" title="No location yet">
              <p>
                Heatclock fetches weather for the garden’s latitude and longitude.{' '}
                {garden.role === 'owner'
                  ? 'Set the location in Garden settings and the weather will follow.'
                  : 'The garden’s owner can set the location in Garden settings.'}
              </p>
              <Link
                to={`/g/${garden.id}/settings`}
                className="mt-1 inline-flex min-h-11 items-center gap-2 font-semibold text-frost underline"
              >
                <Settings className="size-4" aria-hidden="true" />
                Garden settings
              </Link>
            </Notice>
          )}

          {weather.data.days.length > 0 ? (
            <>
              <WeatherChartPanel weather={weather.data} />
              <WeatherTable weather={weather.data} />
            </>
          ) : (
            <p>No temperatures yet for {formatFullRange(weather.data.from, weather.data.to)}.</p>
          )}

          {canEdit && <StationUploadForm key={garden.id} gardenId={garden.id} gardenUnit={garden.units} />}
          {garden.role === 'owner' && <WeatherRunsTable gardenId={garden.id} timeZone={garden.timeZone} />}
        </>
      )}
    </div>
  );
}
