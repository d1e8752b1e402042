import { useId } from 'react';
import { useForm } from 'react-hook-form';
import { UNITS } from '#shared/schemas/gardens';
import type { DisplayUnit } from '#shared/schemas/gardens';
import type { WeatherImportResult } from '#shared/schemas/weather';
import type { ApiError } from '@/lib/api-client';
import { formatFullRange, UNIT_WORDS } from '@/lib/format';
import { mutationProblem } from '@/lib/problems';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { FILE_INPUT_CLASS, UploadButton } from '@/components/ui/upload-button';
import { Notice } from '@/components/ui/notice';
import { RowReport } from '@/components/ui/row-report';
import { FieldError } from '@/components/ui/text-field';
import { useImportWeatherCsv } from '@/features/weather/api/import-weather-csv';
import { formatCount } from '@/features/weather/utils/format-weather';

const MAX_BYTES = 2 * 1024 * 1024;

const EXAMPLES: Record<DisplayUnit, string> = {
  F: 'date,high,low\n2026-05-01,68.4,45.1\n2026-05-02,71.2,48.0',
  C: 'date,high,low\n2026-05-01,20.2,7.3\n2026-05-02,21.8,8.9',
};

interface UploadValues {
  unit: DisplayUnit;
  file: FileList | null;
}

function checkFile(files: FileList | null): true | string {
  const file = files?.[0];
  if (!file) return 'Choose a CSV file to upload.';
  if (!/\.(csv|txt)$/i.test(file.name)) return 'Choose a .csv file (text with columns date, high, low).';
  if (file.size > MAX_BYTES) return 'The file is larger than 2 MB. Split it into smaller files, a year or two each.';
  return true;
}

function ImportOutcome({ result }: { result: WeatherImportResult }) {
  if (result.alreadyImported) {
    return (
      <Notice tone="info" title="Already imported" live="status">
        This exact file was uploaded before, so nothing changed.
      </Notice>
    );
  }
  const span = result.from && result.to ? ` (${formatFullRange(result.from, result.to)})` : '';
  return (
    <Notice tone="success" title="Station readings imported" live="status">
      {formatCount(result.rowsInFile, 'day', 'days')} read from the file{span}: {result.rowsAdded} new,{' '}
      {result.rowsChanged} changed. They now show as “your station” in the chart and table.
    </Notice>
  );
}

function ImportFailure({ error }: { error: ApiError }) {
  if (error.code === 'csv_invalid') {
    return (
      <Notice tone="error" title="Nothing was imported" live="alert">
        <p>
          {error.message} Fix {error.rows.length === 1 ? 'this row' : 'these rows'} in the file and upload it again; no
          day is saved until the whole file is right.
        </p>
        {error.rows.length > 0 && <RowReport rows={error.rows} />}
      </Notice>
    );
  }
  return (
    <Notice tone="error" title="Nothing was imported" live="alert">
      {mutationProblem(error, 'the chosen file is kept')}
    </Notice>
  );
}

export function StationUploadForm({ gardenId, gardenUnit }: { gardenId: number; gardenUnit: DisplayUnit }) {
  const id = useId();
  const upload = useImportWeatherCsv(gardenId);
  const submission = useSubmissionKey();
  const {
    register,
    handleSubmit,
    watch,
    resetField,
    formState: { errors, isSubmitting },
  } = useForm<UploadValues>({ defaultValues: { unit: gardenUnit, file: null } });

  // Returned to the form, so it counts as submitting (and the button stays off) until the answer.
  const onSubmit = handleSubmit((values) => {
    const file = values.file?.[0];
    if (!file) return;
    const { unit } = values;
    const idempotencyKey = submission.keyFor({ name: file.name, size: file.size, lastModified: file.lastModified, unit });
    return upload.mutateAsync({ unit, file, idempotencyKey }).then(
      () => {
        submission.renew();
        resetField('file');
      },
      // Shown from the mutation's own error below.
      () => undefined,
    );
  });

  const serverFields = upload.error?.fields ?? {};
  const fileError = errors.file?.message ?? serverFields.file;
  const unitError = serverFields.unit;
  const exampleUnit = watch('unit');

  return (
    <section aria-labelledby={`${id}-heading`} className="flex flex-col gap-4 rounded-lg border border-line bg-paper-raised p-4 sm:p-5">
      <h2 id={`${id}-heading`} className="text-lg font-bold">
        Upload your own station’s readings
      </h2>
      <div className="flex max-w-prose flex-col gap-2">
        <p>
          Have a weather station in the garden? Upload its daily highs and lows as a CSV file (up to 2 MB). For those
          days your station’s readings replace the weather service’s. Uploading the same file again changes nothing.
        </p>
        <p id={`${id}-format`}>
          The first row names the columns: <strong>date</strong> (YYYY-MM-DD), <strong>high</strong> and{' '}
          <strong>low</strong>. Headings such as tmax/tmin, temp_max/temp_min or “High (°F)” work too. For example:
        </p>
        <pre className="w-fit max-w-full overflow-x-auto rounded-md border border-line bg-paper-sunk px-3 py-2 text-sm">
          {EXAMPLES[exampleUnit]}
        </pre>
      </div>

      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        <fieldset aria-describedby={unitError ? `${id}-unit-error` : undefined}>
          <legend className="mb-2 font-semibold">Unit of the temperatures in the file</legend>
          <div className="flex flex-wrap gap-3">
            {UNITS.map((unit) => (
              <label
                key={unit}
                className="flex min-h-11 cursor-pointer items-center gap-2 rounded-md border border-line bg-paper px-4 has-checked:border-2 has-checked:border-loam has-checked:font-semibold"
              >
                <input type="radio" value={unit} className="size-4 accent-loam" {...register('unit')} />
                {UNIT_WORDS[unit]}
              </label>
            ))}
          </div>
          {unitError && <FieldError id={`${id}-unit-error`}>{unitError}</FieldError>}
        </fieldset>

        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-file`} className="font-semibold">
            CSV file
          </label>
          <input
            id={`${id}-file`}
            type="file"
            accept=".csv,text/csv"
            aria-invalid={fileError ? true : undefined}
            aria-describedby={[`${id}-format`, fileError ? `${id}-file-error` : null].filter(Boolean).join(' ')}
            className={FILE_INPUT_CLASS}
            {...register('file', { validate: checkFile })}
          />
          {fileError && <FieldError id={`${id}-file-error`}>{fileError}</FieldError>}
        </div>

        <div>
          <UploadButton pending={isSubmitting || upload.isPending} label="Upload readings" pendingLabel="Uploading…" />
        </div>
      </form>

      {upload.isSuccess && <ImportOutcome result={upload.data} />}
      {upload.error && <ImportFailure error={upload.error} />}
    </section>
  );
}
