import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import type { UseQueryResult } from '@tanstack/react-query';
import type { AlertDto } from '#shared/schemas/alerts';
import type { GardenDto } from '#shared/schemas/gardens';
import { TODAY_LIMIT } from '#shared/schemas/progress';
import type { TodayDto } from '#shared/schemas/progress';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { formatWeekdayDayMonth } from '@/lib/format';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useAlerts } from '@/features/alerts/api/get-alerts';
import { AlertCards } from '@/features/alerts/components/alert-cards';
import { GardenAbout, hasLocation, NoLocationNotice } from '@/features/gardens/components/garden-about';
import { useToday } from '@/features/progress/api/get-today';
import { GrowingNow } from '@/features/progress/components/growing-now';
import { NeedsAttention } from '@/features/progress/components/needs-attention';
import { TodayWeather } from '@/features/progress/components/today-weather';

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex min-w-0 flex-col gap-3">
      <h2 id={id} className="text-xl font-bold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/**
 * The open alerts in full first; Today's actions are made from them, so only those not shown
 * above are listed after (all of them when the alerts cannot be loaded).
 */
function Attention({ garden, today, open }: { garden: GardenDto; today: TodayDto; open: UseQueryResult<{ items: AlertDto[] }> }) {
  const alerts = open.data?.items ?? [];
  return (
    <>
      {open.isError && (
        <LoadProblem error={open.error} what="alerts" retrying={open.isFetching} onRetry={() => open.refetch()} />
      )}
      {alerts.length > 0 && <AlertCards alerts={alerts} gardenId={garden.id} timeZone={garden.timeZone} canAcknowledge={garden.role !== 'viewer'} />}
      <NeedsAttention gardenId={garden.id} today={today} shownAlertIds={alerts.map((a) => a.id)} />
      <Link to={`/g/${garden.id}/alerts`} className="inline-flex min-h-11 items-center self-start font-semibold text-frost underline">
        All alerts and their history
      </Link>
    </>
  );
}

function TodaySections({ garden }: { garden: GardenDto }) {
  const today = useToday(garden.id);
  // The same most severe open alerts Today's actions are made from (the server's order and limit).
  const open = useAlerts(garden.id, { status: 'open', limit: TODAY_LIMIT });
  // One wait for both, so the actions never show before the alerts that replace them.
  if (today.isPending || open.isPending) return <Loading label="Loading today’s figures…" />;
  if (today.isError) {
    return <LoadProblem error={today.error} what="today" retrying={today.isFetching} onRetry={() => today.refetch()} />;
  }
  return (
    <>
      <p className="text-loam-soft">As of {formatWeekdayDayMonth(today.data.today)}, the garden’s own date.</p>
      <Section id="needs-attention" title="Needs attention">
        <Attention garden={garden} today={today.data} open={open} />
      </Section>
      <Section id="growing-now" title="Growing now">
        <GrowingNow gardenId={garden.id} today={today.data} />
      </Section>
      <Section id="weather-days" title="Weather">
        <TodayWeather today={today.data} />
      </Section>
    </>
  );
}

/** Each garden's landing page: what needs doing, what is growing, and the fortnight's weather. */
export function TodayPage() {
  const garden = useCurrentGarden();
  return (
    <div className="flex flex-col gap-6">
      <title>{`Today · ${garden.name} · Heatclock`}</title>
      <div>
        <h1 className="text-2xl font-bold sm:text-3xl">Today</h1>
        <p className="font-semibold break-words">{garden.name}</p>
      </div>
      {!hasLocation(garden) && <NoLocationNotice garden={garden} />}
      <TodaySections garden={garden} />
      <GardenAbout garden={garden} />
    </div>
  );
}
