import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { countOf } from '#shared/format/count-words';
import { CLIMATE_MIN_YEARS, climateOverrideSchema } from '#shared/schemas/climate';
import type { ClimateDto, ClimateOverrideInput, FrostDateFigure } from '#shared/schemas/climate';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { formatDayMonth, formatTemp } from '@/lib/format';
import { mutationProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useClimate } from '@/features/climate/api/get-climate';
import { useUpdateClimateOverride } from '@/features/climate/api/update-climate';

const FIELDS = ['lastSpringFrost50', 'firstFallFrost50', 'zone'] as const;

/** A month-day 'MM-DD' in the reader's words, read on a leap year so 29 February is a day too. */
export function monthDayWords(monthDay: string): string {
  return formatDayMonth(`2000-${monthDay}`);
}

const yearsWords = (n: number, unit = 'year') => `from ${countOf(n, unit)} of this garden’s weather${n < CLIMATE_MIN_YEARS ? ' (an estimate)' : ''}`;

function frostWords(f: FrostDateFigure, none: string): string {
  if (f.years === 0) return 'Not known yet.';
  const at = (md: string | null) => (md ? monthDayWords(md) : none);
  return `Half of seasons by ${at(f.p50)}; 1 in 10 by ${at(f.p10)}; 9 in 10 by ${at(f.p90)}.`;
}

function Fact({ term, children, basis, override }: { term: string; children: string; basis: string; override?: string | null }) {
  return (
    <div className="flex flex-col gap-0.5 border-b border-line py-3 last:border-b-0 sm:grid sm:grid-cols-[12rem_1fr] sm:gap-4">
      <dt className="font-semibold">{term}</dt>
      <dd className="flex flex-col gap-0.5">
        {override && <span className="font-semibold">Your setting: {override}.</span>}
        <span>
          {override ? 'The weather history says: ' : ''}
          {children}
        </span>
        <span className="text-sm text-loam-soft">{basis}</span>
      </dd>
    </div>
  );
}

function ClimateFacts({ climate }: { climate: ClimateDto }) {
  const o = climate.override;
  const spring = climate.lastSpringFrost;
  const fall = climate.firstFallFrost;
  const free = climate.frostFreeDays;
  const min = climate.extremeMinimum;
  return (
    <dl>
      <Fact term="Last spring frost" basis={yearsWords(spring.years, 'season')} override={o?.lastSpringFrost50 ? `about ${monthDayWords(o.lastSpringFrost50)}` : null}>
        {frostWords(spring, 'the start of the season (no spring frost)')}
      </Fact>
      <Fact term="First fall frost" basis={yearsWords(fall.years, 'season')} override={o?.firstFallFrost50 ? `about ${monthDayWords(o.firstFallFrost50)}` : null}>
        {frostWords(fall, 'the end of the season (no fall frost)')}
      </Fact>
      <Fact term="Frost-free season" basis={yearsWords(free.years, 'season')}>
        {free.p50 === null ? 'Not known yet.' : `${countOf(free.p50, 'day')} in a middling season; ${free.p10 ?? '—'} in a short one (1 in 10), ${free.p90 ?? '—'} in a long one (9 in 10).`}
      </Fact>
      <Fact term="Coldest night of winter, on average" basis={yearsWords(min.years, 'winter')}>
        {min.mean === null ? 'Not known yet.' : formatTemp(min.mean, min.unit)}
      </Fact>
      <Fact term="Hardiness zone" basis={`${yearsWords(climate.zone.years, 'winter')}, by the USDA 2023 map’s method`} override={o?.zone ?? null}>
        {climate.zone.zone ?? 'Not known yet.'}
      </Fact>
    </dl>
  );
}

type FormInput = z.input<typeof climateOverrideSchema>;
const blankIsNull = (value: unknown) => (typeof value === 'string' && value.trim() === '' ? null : value);

function OverrideForm({ gardenId, climate }: { gardenId: number; climate: ClimateDto }) {
  const update = useUpdateClimateOverride(gardenId);
  const [saved, setSaved] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const o = climate.override;
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormInput, unknown, ClimateOverrideInput>({
    resolver: zodResolver(climateOverrideSchema),
    defaultValues: { lastSpringFrost50: o?.lastSpringFrost50 ?? null, firstFallFrost50: o?.firstFallFrost50 ?? null, zone: o?.zone ?? null },
  });

  const onSubmit = handleSubmit(async (values) => {
    setSaved(false);
    setProblem(null);
    try {
      await update.mutateAsync({ lastSpringFrost50: values.lastSpringFrost50 ?? null, firstFallFrost50: values.firstFallFrost50 ?? null, zone: values.zone ?? null });
      setSaved(true);
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, FIELDS);
      if (placed === 0 || leftover.length > 0) setProblem([mutationProblem(error, 'your figures are kept'), ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <h3 className="text-lg font-bold">Your own figures</h3>
      <p className="text-loam-soft">If you know this place better than its weather record does, set the figures here; leave a box empty to use the history.</p>
      {problem && (
        <Notice tone="error" title="Not saved" live="alert">
          {problem}
        </Notice>
      )}
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField label="Last spring frost" hint="Month and day, MM-DD, e.g. 04-25." autoComplete="off" inputMode="numeric" error={errors.lastSpringFrost50?.message} {...register('lastSpringFrost50', { setValueAs: blankIsNull })} />
        <TextField label="First fall frost" hint="Month and day, MM-DD, e.g. 10-12." autoComplete="off" inputMode="numeric" error={errors.firstFallFrost50?.message} {...register('firstFallFrost50', { setValueAs: blankIsNull })} />
        <TextField label="Hardiness zone" hint="From 1a to 13b, e.g. 6b." autoComplete="off" spellCheck={false} error={errors.zone?.message} {...register('zone', { setValueAs: blankIsNull })} />
      </div>
      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Save climate figures'}
        </Button>
        <p role="status" className="text-leaf">
          {saved && 'Climate figures saved.'}
        </p>
      </div>
    </form>
  );
}

/** "Climate here": frost dates, frost-free season, winter minimum and zone from the garden's own weather. */
export function ClimateFactsSection({ gardenId, isOwner }: { gardenId: number; isOwner: boolean }) {
  const climate = useClimate(gardenId);
  const c = climate.data;
  return (
    <section aria-labelledby="climate-heading" className="flex flex-col gap-4 rounded-lg border border-line bg-paper-raised p-4 sm:p-6">
      <h2 id="climate-heading" className="text-xl font-bold">
        Climate here
      </h2>
      {climate.isPending && <Loading label="Loading this garden’s climate…" />}
      {climate.isError && <LoadProblem error={climate.error} what="this garden’s climate" onRetry={() => climate.refetch()} retrying={climate.isFetching} compact />}
      {c && (
        <>
          <p className="text-loam-soft">
            From this garden’s own weather: a frost is a night at or below {c.extremeMinimum.unit === 'F' ? '32 °F' : '0 °C'}.
            {c.hemisphere === 'south' && ' Seasons run July to June.'}
          </p>
          {c.reason && (
            <Notice tone="info" title="No figures yet">
              {c.reason}
            </Notice>
          )}
          {!c.reason && c.estimate && (
            <Notice tone="info" title="Estimate">
              Only {countOf(c.years, 'year')} of weather: figures from fewer than {CLIMATE_MIN_YEARS} years can be well off.
            </Notice>
          )}
          <ClimateFacts climate={c} />
          {isOwner ? <OverrideForm gardenId={gardenId} climate={c} /> : c.override && <p className="text-sm text-loam-soft">“Your setting” figures are the owner’s.</p>}
        </>
      )}
    </section>
  );
}
