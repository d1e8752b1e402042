import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { Thermometer } from 'lucide-react';
import type { DisplayUnit } from '#shared/schemas/gardens';
import type { GardenSoilResponse, SoilCropDto, SoilDaySource, SoilReadingDto } from '#shared/schemas/soil';
import { Button } from '@/components/ui/button';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { formatDayInContext, formatDayMonth, formatTemp, formatTempRange } from '@/lib/format';
import { mutationProblem } from '@/lib/problems';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { useSoil } from '@/features/soil/api/get-soil';
import { useAddSoilReading, useDeleteSoilReading } from '@/features/soil/api/soil-readings';
import { parseTypedNumber } from '@/lib/typed-number';

export const SOIL_SOURCE_WORDS: Record<SoilDaySource, string> = {
  reading: 'your thermometer',
  observed: 'the weather service’s estimate',
  forecast: 'the weather service’s forecast',
};

/** "48.2 °F on Dec 2 (your thermometer)". */
export function soilNowWords(current: NonNullable<GardenSoilResponse['current']>, unit: DisplayUnit, today: string): string {
  return `${formatTemp(current.temperature, unit)} ${formatDayInContext(current.date, today)} (${SOIL_SOURCE_WORDS[current.source]})`;
}

const STATUS_WORDS: Record<SoilCropDto['status'], string> = {
  'too-cold': 'Too cold',
  cool: 'Slow',
  good: 'Good',
  'too-warm': 'Too warm',
  unknown: 'No range',
};
/** Order of the crop table: what can be sown now first. */
const STATUS_ORDER: SoilCropDto['status'][] = ['good', 'cool', 'too-warm', 'too-cold', 'unknown'];

interface ReadingValues {
  readOn: string;
  temperature: string;
  depthCm: string;
  note: string;
}

function ReadingForm({ gardenId, unit, today }: { gardenId: number; unit: DisplayUnit; today: string }) {
  const id = useId();
  const add = useAddSoilReading(gardenId);
  const submission = useSubmissionKey();
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<ReadingValues>({ defaultValues: { readOn: today, temperature: '', depthCm: '', note: '' } });
  const onSubmit = handleSubmit(async (v) => {
    const temperature = parseTypedNumber(v.temperature, { negative: true });
    if (temperature === null || !Number.isFinite(temperature)) {
      setError('temperature', { message: `Type the thermometer’s figure in °${unit}, e.g. ${unit === 'F' ? '52' : '11'}.` });
      return;
    }
    const depth = parseTypedNumber(v.depthCm);
    if (depth !== null && !Number.isFinite(depth)) {
      setError('depthCm', { message: 'Type the depth in centimetres, e.g. 5, or leave it blank.' });
      return;
    }
    const input = { readOn: v.readOn, temperature, depthCm: depth, note: v.note.trim() };
    try {
      await add.mutateAsync({ input, idempotencyKey: submission.keyFor(input) });
      submission.renew();
      reset({ readOn: v.readOn, temperature: '', depthCm: '', note: '' });
    } catch (error) {
      applyServerFieldErrors(error, setError, ['readOn', 'temperature', 'depthCm', 'note'] as const);
    }
  });
  return (
    <form onSubmit={onSubmit} noValidate aria-label="Add a soil reading" className="flex flex-col gap-3 rounded-lg border border-line bg-paper px-4 py-4">
      <h3 className="font-bold">Add your thermometer reading</h3>
      <p id={`${id}-how`} className="text-sm text-loam-soft">
        Push a soil thermometer to seed depth (about 5 cm, 2 in) in the morning, when the soil is coolest.
      </p>
      <div className="grid gap-3 sm:grid-cols-3">
        <TextField label="Day" type="date" max={today} error={errors.readOn?.message} {...register('readOn')} />
        <TextField label={`Soil temperature (°${unit})`} unit={`°${unit}`} inputMode="decimal" autoComplete="off" error={errors.temperature?.message} {...register('temperature')} />
        <TextField label="Depth (cm, optional)" unit="cm" inputMode="decimal" autoComplete="off" error={errors.depthCm?.message} {...register('depthCm')} />
      </div>
      <TextField label="Note (optional)" autoComplete="off" error={errors.note?.message} {...register('note')} />
      <div>
        <Button type="submit" disabled={isSubmitting}>
          <Thermometer className="size-4" aria-hidden="true" />
          {isSubmitting ? 'Saving…' : 'Save reading'}
        </Button>
      </div>
      {add.isSuccess && (
        <Notice tone="success" title="Reading saved" live="status">
          The advice below now reads your thermometer.
        </Notice>
      )}
      {add.isError && !Object.keys(errors).length && (
        <Notice tone="error" title="Reading not saved" live="alert">
          {mutationProblem(add.error, 'your reading is kept')}
        </Notice>
      )}
    </form>
  );
}

function Reading({ gardenId, reading: r, unit, canEdit }: { gardenId: number; reading: SoilReadingDto; unit: DisplayUnit; canEdit: boolean }) {
  const remove = useDeleteSoilReading(gardenId, r.id);
  return (
    <li className="flex flex-wrap items-center justify-between gap-2 py-2">
      <span>
        <span className="font-semibold">{formatTemp(r.temperature, unit)}</span> on {formatDayMonth(r.readOn)}
        {r.depthCm !== null && ` at ${r.depthCm} cm`}
        {r.note && ` · ${r.note}`}
        {r.by && <span className="text-sm text-loam-soft"> · by {r.by}</span>}
      </span>
      {canEdit && (
        <ConfirmDelete
          compact
          label={`Delete the reading of ${formatDayMonth(r.readOn)}`}
          question="Delete this reading?"
          consequence="The advice goes back to the other readings of the day, or the weather service’s estimate."
          confirmLabel="Delete reading"
          onConfirm={() => remove.mutate()}
          pending={remove.isPending}
          error={remove.error}
        />
      )}
    </li>
  );
}

/**
 * Soil temperature and what it means for sowing each crop now. `highlight`: crop keys to show
 * first (the varieties the page is about).
 */
export function SoilPanel({ gardenId, today, canEdit, highlight = [] }: { gardenId: number; today: string; canEdit: boolean; highlight?: string[] }) {
  const soil = useSoil(gardenId);
  if (soil.isPending) return <Loading label="Loading soil temperatures…" />;
  if (soil.isError) return <LoadProblem error={soil.error} what="soil temperatures" onRetry={() => soil.refetch()} retrying={soil.isFetching} />;
  const s = soil.data;
  // The figures are in the unit the answer says: a cached answer may predate a change of the garden's unit.
  const unit = s.unit;
  const crops = [...s.crops].sort(
    (a, b) =>
      Number(highlight.includes(b.key)) - Number(highlight.includes(a.key)) ||
      STATUS_ORDER.indexOf(a.status) - STATUS_ORDER.indexOf(b.status) ||
      a.name.localeCompare(b.name),
  );
  return (
    <div className="flex flex-col gap-4">
      {s.current ? (
        <p className="text-lg">
          <span className="font-semibold">Soil now: {soilNowWords(s.current, unit, today)}.</span>
        </p>
      ) : (
        <p>No soil temperature yet: add a thermometer reading, or wait for the weather service’s next estimate.</p>
      )}
      {s.forecast.length > 0 && (
        <p className="text-sm text-loam-soft">
          Forecast soil: {s.forecast.map((d) => `${formatDayMonth(d.date)} ${formatTemp(d.temperature, unit)}`).join(' · ')}.
        </p>
      )}
      {crops.length > 0 && (
        // A phone gets one card per crop; four columns do not fit 390 px.
        <ul aria-label="Sowing each crop now" className="flex flex-col divide-y divide-line rounded-md border border-line sm:hidden">
          {crops.map((c) => (
            <li key={c.key} className={`flex flex-col gap-0.5 px-3 py-2 ${highlight.includes(c.key) ? 'bg-paper-sunk' : ''}`}>
              <span>
                <span className="font-semibold">{c.name}</span> · <span className="font-semibold">{STATUS_WORDS[c.status]}</span>
              </span>
              <span>{c.words}</span>
              {c.germ && <span className="text-sm text-loam-soft">Sprouts in soil of {formatTempRange(c.germ.min, c.germ.max, unit)}</span>}
            </li>
          ))}
        </ul>
      )}
      {crops.length > 0 && (
        <div className="hidden overflow-x-auto sm:block">
          <table className="w-full text-left text-sm">
            <caption className="sr-only">Whether the soil suits sowing each crop now, and the days to emergence</caption>
            <thead>
              <tr className="border-b border-line">
                <th scope="col" className="py-2 pr-3">Crop</th>
                <th scope="col" className="py-2 pr-3">Sprouts in soil of</th>
                <th scope="col" className="py-2 pr-3">Now</th>
                <th scope="col" className="py-2">What it means</th>
              </tr>
            </thead>
            <tbody>
              {crops.map((c) => (
                <tr key={c.key} className={`border-b border-line last:border-b-0 ${highlight.includes(c.key) ? 'bg-paper-sunk' : ''}`}>
                  <th scope="row" className="py-2 pr-3 font-semibold">{c.name}</th>
                  <td className="py-2 pr-3 whitespace-nowrap">{c.germ ? formatTempRange(c.germ.min, c.germ.max, unit) : '—'}</td>
                  <td className="py-2 pr-3 font-semibold whitespace-nowrap">{STATUS_WORDS[c.status]}</td>
                  <td className="py-2">{c.words}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {crops.length > 0 && (
        <p className="text-sm text-loam-soft">
          Days to emergence are means at a steady soil temperature from a published seed table (Harrington &amp; Minges, 1954), read between its temperatures; real beds
          swing by day and night, so take them as a guide. Germination ranges are Oregon State Extension’s.
        </p>
      )}
      {canEdit && <ReadingForm gardenId={gardenId} unit={unit} today={today} />}
      {s.readings.length > 0 && (
        <div>
          <h3 className="font-bold">Recent readings</h3>
          <ul className="divide-y divide-line">
            {s.readings.map((r) => (
              <Reading key={r.id} gardenId={gardenId} reading={r} unit={unit} canEdit={canEdit} />
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
