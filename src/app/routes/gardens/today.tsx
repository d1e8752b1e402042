import type { ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { formatWeekdayDayMonth } from '@/lib/format';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
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

function TodaySections({ gardenId }: { gardenId: number }) {
  const today = useToday(gardenId);
  if (today.isPending) return <Loading label="Loading today’s figures…" />;
  if (today.isError) {
    return (
      <div className="flex flex-col items-start gap-3">
        <Notice tone="error" title="Today could not be loaded — try again" live="alert">
          {today.error.message}
        </Notice>
        <Button variant="quiet" onClick={() => today.refetch()} disabled={today.isFetching}>
          Try again
        </Button>
      </div>
    );
  }
  return (
    <>
      <p className="text-loam-soft">As of {formatWeekdayDayMonth(today.data.today)}, the garden’s own date.</p>
      <Section id="needs-attention" title="Needs attention">
        <NeedsAttention gardenId={gardenId} today={today.data} />
      </Section>
      <Section id="growing-now" title="Growing now">
        <GrowingNow gardenId={gardenId} today={today.data} />
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
      <TodaySections gardenId={garden.id} />
      <GardenAbout garden={garden} />
    </div>
  );
}
