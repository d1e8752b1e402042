import { useId, useState } from 'react';
import { Download, X } from 'lucide-react';
import {
  HARVEST_UNITS,
  LOG_KINDS,
  PLANTING_CSV_COLUMNS,
  PLANTING_METHODS,
  PLANTING_QUANTITY_UNITS,
  PLANTING_STATUSES,
} from '#shared/schemas/plantings';
import type { ImportReport } from '#shared/schemas/plantings';
import type { ApiError } from '@/lib/api-client';
import { mutationProblem } from '@/lib/problems';
import { FILE_INPUT_CLASS, UploadButton } from '@/components/ui/upload-button';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { RowReport } from '@/components/ui/row-report';
import { FieldError } from '@/components/ui/text-field';
import { useImportPlantings } from '@/features/plantings/api/import-plantings';

const MAX_BYTES = 2 * 1024 * 1024;
const DATE = 'a date, YYYY-MM-DD';
const list = (values: readonly string[]) => values.join(', ');

const COLUMN_HELP: Record<(typeof PLANTING_CSV_COLUMNS)[number], string> = {
  bed: 'bed name, as on the Beds page (required)',
  crop: 'crop, e.g. lettuce or bok-choy (required)',
  variety: 'variety name, as on the Varieties page (required)',
  seed_lot: 'lot number of a seed lot of that variety',
  method: `${list(PLANTING_METHODS)} (required)`,
  status: `${list(PLANTING_STATUSES)} (required)`,
  quantity: 'a number',
  quantity_unit: `${list(PLANTING_QUANTITY_UNITS)}; plants when empty`,
  sown: DATE,
  emerged: DATE,
  thinned: DATE,
  transplanted: DATE,
  first_harvest: DATE,
  last_harvest: DATE,
  bolted: DATE,
  notes: 'text',
  log_date: `${DATE}, when the row carries a log entry`,
  // Photo entries come with their photo, from the upload; a file cannot carry one.
  log_kind: list(LOG_KINDS.filter((k) => k !== 'photo')),
  log_amount: 'harvests only: a number',
  log_unit: list(HARVEST_UNITS),
  log_note: 'text',
};

export interface ImportExample {
  bed: string;
  crop: string;
  variety: string;
}

/** RFC 4180: a cell with a comma, quote or line break is quoted, its quotes doubled. */
const cell = (value: string) => (/[",\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value);

/** Two rows of one planting, each with a log entry: the layout Export CSV writes. */
function exampleCsv({ bed, crop, variety }: ImportExample, year: string): string {
  const planting = [bed, crop, variety, '', 'direct-sow', 'growing', '24', 'plants', `${year}-04-02`, `${year}-04-10`, '', '', '', '', '', 'First spring sowing'];
  const rows = [
    [...planting, `${year}-04-10`, 'observation', '', '', 'Came up evenly'],
    [...planting, `${year}-04-18`, 'watered', '', '', ''],
  ];
  return [[...PLANTING_CSV_COLUMNS], ...rows].map((r) => r.map(cell).join(',')).join('\r\n') + '\r\n';
}

function Summary({ report: r }: { report: ImportReport }) {
  const nothing = r.plantingsCreated + r.plantingsUpdated + r.logEntriesCreated === 0;
  return (
    <Notice tone={nothing ? 'info' : 'success'} title={nothing ? 'Nothing new in the file' : 'Plantings imported'} live="status">
      Plantings: {r.plantingsCreated} added, {r.plantingsUpdated} updated, {r.plantingsUnchanged} already up to date. Log entries:{' '}
      {r.logEntriesCreated} added, {r.logEntriesExisting} already in the log.
    </Notice>
  );
}

function Failure({ error }: { error: ApiError }) {
  const rows = error.rows;
  return (
    <Notice tone="error" title="Nothing was imported" live="alert">
      <p>
        {mutationProblem(error, 'the chosen file is kept')}
        {rows.length > 0 && ' Fix these rows in the file and upload it again; no planting is saved until the whole file is right.'}
      </p>
      {rows.length > 0 && <RowReport rows={rows} />}
    </Notice>
  );
}

/** Upload of a plantings CSV in the export's own layout; all rows are saved or none. */
export function PlantingImportForm({ gardenId, example, year, onClose }: { gardenId: number; example: ImportExample; year: string; onClose: () => void }) {
  const id = useId();
  const upload = useImportPlantings(gardenId);
  const [file, setFile] = useState<File | null>(null);
  const [fileError, setFileError] = useState<string | null>(null);
  const shownFileError = fileError ?? upload.error?.fields.file;

  const submit = (e: React.FormEvent<HTMLFormElement>) => {
    e.preventDefault();
    if (!file) return setFileError('Choose a CSV file to upload.');
    if (file.size > MAX_BYTES) return setFileError('The file is larger than 2 MB. Split it into smaller files.');
    setFileError(null);
    upload.mutate(file);
  };

  return (
    <section aria-labelledby={`${id}-h`} className="flex flex-col gap-3 rounded-lg border border-line bg-paper-raised p-4">
      <div className="flex items-start justify-between gap-2">
        <h2 id={`${id}-h`} className="text-lg font-bold">
          Import plantings from a CSV file
        </h2>
        <Button variant="quiet" onClick={onClose}>
          <X className="size-5" aria-hidden="true" /> Close
        </Button>
      </div>
      <div className="flex max-w-prose flex-col gap-2">
        <p>
          The file has the same columns as <strong>Export CSV</strong>: one row per log entry, and rows with the same bed,
          variety, method and start date make one planting. Beds and varieties must already exist in this garden; they are
          matched by name. Nothing is saved unless every row is right, and uploading the same file again changes nothing.
        </p>
        <a
          href={`data:text/csv;charset=utf-8,${encodeURIComponent(exampleCsv(example, year))}`}
          download="heatclock-plantings-example.csv"
          className="inline-flex min-h-11 items-center gap-2 self-start font-semibold underline"
        >
          <Download className="size-5" aria-hidden="true" /> Download an example file
        </a>
        <details>
          <summary className="min-h-11 cursor-pointer py-2 font-semibold">What each column holds</summary>
          <dl className="grid gap-x-3 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
            {PLANTING_CSV_COLUMNS.map((c) => (
              <div key={c} className="contents">
                <dt className="font-mono font-semibold">{c}</dt>
                <dd className="mb-1 sm:mb-0">{COLUMN_HELP[c]}</dd>
              </div>
            ))}
          </dl>
        </details>
      </div>
      <form onSubmit={submit} noValidate className="flex flex-col gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-file`} className="font-semibold">
            Plantings CSV file
          </label>
          <input
            id={`${id}-file`}
            type="file"
            accept=".csv,text/csv"
            aria-invalid={shownFileError ? true : undefined}
            aria-describedby={shownFileError ? `${id}-file-error` : undefined}
            onChange={(e) => setFile(e.target.files?.[0] ?? null)}
            className={FILE_INPUT_CLASS}
          />
          {shownFileError && <FieldError id={`${id}-file-error`}>{shownFileError}</FieldError>}
        </div>
        <div>
          <UploadButton pending={upload.isPending} label="Import plantings" pendingLabel="Importing…" />
        </div>
      </form>
      {upload.isSuccess && <Summary report={upload.data} />}
      {upload.isError && !upload.error.fields.file && <Failure error={upload.error} />}
    </section>
  );
}
