import { useMemo, useState } from 'react';
import { useForm } from 'react-hook-form';
import { CircleCheck, PencilLine } from 'lucide-react';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { gardenUpdateSchema } from '#shared/schemas/gardens';
import type { GardenDto, GardenUpdateInput } from '#shared/schemas/gardens';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { formatLatitude, formatLongitude } from '@/lib/format';
import { mutationProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FieldError, TextField } from '@/components/ui/text-field';
import { useUpdateGarden } from '@/features/gardens/api/update-garden';
import { PlaceFinder, placeLabel } from '@/features/gardens/components/place-finder';
import type { PlaceDto } from '#shared/schemas/places';

const FIELDS = ['name', 'latitude', 'longitude', 'elevationM', 'timeZone', 'units'] as const;

/**
 * The shared schema, plus one rule only the form needs: the API takes a location as a pair and
 * cannot clear one, so a half-filled or emptied location would otherwise be silently ignored.
 */
function settingsSchema(hadLocation: boolean) {
  return gardenUpdateSchema.superRefine((values, ctx) => {
    const hasLatitude = values.latitude !== undefined;
    const hasLongitude = values.longitude !== undefined;
    if (hasLatitude === hasLongitude && (hasLatitude || !hadLocation)) return;
    if (!hasLatitude) {
      ctx.addIssue({ code: 'custom', path: ['latitude'], message: 'Enter a latitude; a location needs both numbers.' });
    }
    if (!hasLongitude) {
      ctx.addIssue({ code: 'custom', path: ['longitude'], message: 'Enter a longitude; a location needs both numbers.' });
    }
  });
}

type FormInput = z.input<typeof gardenUpdateSchema>;

// Inputs hold text; the schema wants numbers. Blank means "no value", never zero.
const toNumber = (blank: undefined | null) => (value: unknown) => {
  if (typeof value !== 'string') return value;
  const trimmed = value.trim();
  return trimmed === '' ? blank : Number(trimmed);
};

function toFormValues(garden: GardenDto): FormInput {
  return {
    name: garden.name,
    latitude: garden.latitude ?? undefined,
    longitude: garden.longitude ?? undefined,
    elevationM: garden.elevationM,
    timeZone: garden.timeZone,
    units: garden.units,
  };
}

function timeZoneNames(): string[] {
  return typeof Intl.supportedValuesOf === 'function' ? Intl.supportedValuesOf('timeZone') : [];
}

export function GardenSettingsForm({ garden }: { garden: GardenDto }) {
  const update = useUpdateGarden(garden.id);
  const [saved, setSaved] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const [chosen, setChosen] = useState<PlaceDto | null>(null);
  const zones = useMemo(timeZoneNames, []);
  const schema = useMemo(
    () => settingsSchema(garden.latitude !== null && garden.longitude !== null),
    [garden.latitude, garden.longitude],
  );

  const {
    register,
    handleSubmit,
    setError,
    setValue,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<FormInput, unknown, GardenUpdateInput>({
    resolver: zodResolver(schema),
    defaultValues: toFormValues(garden),
  });

  // The match fills the fields; nothing is saved until the grower has looked and pressed Save.
  const usePlace = (place: PlaceDto) => {
    const touched = { shouldDirty: true, shouldValidate: true } as const;
    setValue('latitude', place.latitude, touched);
    setValue('longitude', place.longitude, touched);
    setValue('timeZone', place.timeZone, touched);
    setChosen(place);
    setSaved(false);
  };

  const onSubmit = handleSubmit(async (values) => {
    setSaved(false);
    setChosen(null);
    setProblem(null);
    try {
      const updated = await update.mutateAsync(values);
      reset(toFormValues(updated));
      setSaved(true);
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, FIELDS);
      if (placed === 0 || leftover.length > 0) {
        setProblem([mutationProblem(error, 'your changes are kept'), ...leftover].join(' '));
      }
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {problem && (
        <Notice tone="error" title="Not saved" live="alert">
          {problem}
        </Notice>
      )}

      <TextField label="Garden name" autoComplete="off" error={errors.name?.message} {...register('name')} />

      <fieldset className="flex flex-col gap-4">
        <legend className="mb-2 text-lg font-bold">Location</legend>
        <PlaceFinder onChoose={usePlace} />
        {chosen && (
          <Notice tone="info" title={`Filled in from ${placeLabel(chosen)}`} live="status">
            {formatLatitude(chosen.latitude)}, {formatLongitude(chosen.longitude)} and time zone {chosen.timeZone}. A town’s centre can be a few kilometres from
            your plot: adjust the numbers if you know better, then Save settings.
          </Notice>
        )}
        <div className="grid gap-4 sm:grid-cols-2">
          <TextField
            label="Latitude (decimal degrees, °)"
            hint="North of the equator is positive, south is negative — e.g. 42.36 or -37.81."
            unit="°"
            autoComplete="off"
            error={errors.latitude?.message}
            {...register('latitude', { setValueAs: toNumber(undefined) })}
          />
          <TextField
            label="Longitude (decimal degrees, °)"
            hint="East of Greenwich is positive, west is negative — e.g. -71.06 or 144.96."
            unit="°"
            autoComplete="off"
            error={errors.longitude?.message}
            {...register('longitude', { setValueAs: toNumber(undefined) })}
          />
        </div>
        <TextField
          label="Elevation (m)"
          hint={`Metres above sea level${garden.units === 'F' ? ' (1 m is 3.28 ft)' : ''}. Leave blank if you don’t know it.`}
          unit="m"
          autoComplete="off"
          className="sm:max-w-xs"
          error={errors.elevationM?.message}
          {...register('elevationM', { setValueAs: toNumber(null) })}
        />
      </fieldset>

      <TextField
        label="Time zone"
        hint="An IANA name such as America/Chicago or Australia/Melbourne; start typing to pick one."
        autoComplete="off"
        spellCheck={false}
        list="garden-time-zones"
        error={errors.timeZone?.message}
        {...register('timeZone')}
      />
      <datalist id="garden-time-zones">
        {zones.map((zone) => (
          <option key={zone} value={zone} />
        ))}
      </datalist>

      <fieldset aria-describedby={errors.units ? 'units-error' : undefined}>
        <legend className="mb-2 font-semibold">Display units</legend>
        <div className="flex flex-wrap gap-3">
          {(['F', 'C'] as const).map((unit) => (
            <label
              key={unit}
              className="flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-line bg-paper-raised px-4 has-checked:border-2 has-checked:border-loam has-checked:font-semibold"
            >
              <input type="radio" value={unit} className="size-4 accent-loam" {...register('units')} />
              {unit === 'F' ? '°F (Fahrenheit)' : '°C (Celsius)'}
            </label>
          ))}
        </div>
        {errors.units?.message && <FieldError id="units-error">{errors.units.message}</FieldError>}
      </fieldset>

      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Save settings'}
        </Button>
        <p role="status" className="flex items-center gap-1.5 text-loam-soft">
          {saved && !isDirty && (
            <>
              <CircleCheck className="size-5 text-leaf" aria-hidden="true" />
              <span className="font-semibold text-loam">Settings saved.</span>
            </>
          )}
          {isDirty && (
            <>
              <PencilLine className="size-5" aria-hidden="true" />
              <span>You have unsaved changes.</span>
            </>
          )}
        </p>
      </div>
    </form>
  );
}
