import { useEffect, useId, useState } from 'react';
import { Bean, Droplets, Flower2, Leaf, NotebookPen, Scissors, ShoppingBasket, Shovel, Sprout } from 'lucide-react';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { LOG_KIND_WORDS, STAGE_WORDS, plantingUpdateSchema } from '#shared/schemas/plantings';
import type { HarvestUnit, LogKind, PlantingDto, PlantingUpdateInput } from '#shared/schemas/plantings';
import { massInKg, unitSystemOf } from '#shared/units/measures';
import type { UnitSystem } from '#shared/units/measures';
import { ApiError, isNetworkError } from '@/lib/api-client';
import { enqueue } from '@/lib/offline-queue';
import { formatDayInContext } from '@/lib/format';
import { mutationProblem, problemKind } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useAddLogEntry } from '@/features/plantings/api/add-log-entry';
import { useUpdatePlanting } from '@/features/plantings/api/update-planting';
import { CONTROL } from '@/features/plantings/components/field-styles';
import { parseTypedNumber } from '@/lib/typed-number';

/** A stage tap sets one of the planting's own dates; every other tap adds a log entry. */
type StageKind = 'sown' | 'emerged' | 'transplanted';
type EntryKind = Exclude<LogKind, 'photo'>;
export type QuickKind = EntryKind | StageKind;

const STAGE_FIELD = { sown: 'sownOn', emerged: 'emergedOn', transplanted: 'transplantedOn' } as const;
const isStage = (kind: QuickKind): kind is StageKind => kind in STAGE_FIELD;

const KINDS: { kind: QuickKind; icon: typeof Leaf }[] = [
  { kind: 'watered', icon: Droplets },
  { kind: 'fed', icon: Leaf },
  { kind: 'thinned', icon: Scissors },
  { kind: 'harvest', icon: ShoppingBasket },
  { kind: 'bolted', icon: Flower2 },
  { kind: 'observation', icon: NotebookPen },
  { kind: 'sown', icon: Bean },
  { kind: 'emerged', icon: Sprout },
  { kind: 'transplanted', icon: Shovel },
];

const kindWords = (kind: QuickKind) => (isStage(kind) ? STAGE_WORDS[STAGE_FIELD[kind]] : LOG_KIND_WORDS[kind]);

/** The units a harvest is typed in: the garden's masses, and counts either way. */
type AmountUnit = 'kg' | 'g' | 'lb' | 'oz' | 'count' | 'bunches';
const AMOUNT_UNITS: Record<UnitSystem, AmountUnit[]> = { metric: ['kg', 'g', 'count', 'bunches'], us: ['lb', 'oz', 'count', 'bunches'] };
const AMOUNT_UNIT_WORDS: Record<AmountUnit, string> = { kg: 'kg', g: 'g', lb: 'lb', oz: 'oz', count: 'pieces', bunches: 'bunches' };

/**
 * What is sent for a typed amount. Metric and counts go as typed; pounds and ounces go as
 * kilograms (stored SI, 4 decimals = 0.1 g, the precision shared/units/measures.ts keeps).
 */
export function amountToSend(amount: number, unit: AmountUnit): { amount: number; amountUnit: HarvestUnit } {
  if (unit === 'lb' || unit === 'oz') return { amount: Number(massInKg(amount, unit)!.toFixed(4)), amountUnit: 'kg' };
  return { amount, amountUnit: unit };
}

/** The entry being typed, kept on this device until Heatclock has it. */
interface Draft {
  kind: QuickKind;
  entryOn: string;
  amount: string;
  unit: AmountUnit;
  note: string;
  /** Names this one entry; the same on every retry of it, new once it is saved or changed. */
  key: string;
}

export const draftStorageKey = (gardenId: number, plantingId: number) => `heatclock:quick-log:${gardenId}:${plantingId}`;

function newKey(): string {
  // randomUUID exists only on secure origins; a plain-http install still gets 128 random bits.
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  return Array.from(crypto.getRandomValues(new Uint8Array(16)), (b) => b.toString(16).padStart(2, '0')).join('');
}

function readDraft(storageKey: string, system: UnitSystem): Draft | null {
  try {
    const raw = localStorage.getItem(storageKey);
    if (!raw) return null;
    const d = JSON.parse(raw) as Partial<Draft>;
    if (!d.kind || !KINDS.some((k) => k.kind === d.kind) || typeof d.entryOn !== 'string') return null;
    return {
      kind: d.kind,
      entryOn: d.entryOn,
      amount: typeof d.amount === 'string' ? d.amount : '',
      // A garden switched between °C and °F since: the amount is typed again in its units.
      unit: d.unit && AMOUNT_UNITS[system].includes(d.unit) ? d.unit : AMOUNT_UNITS[system][0],
      note: typeof d.note === 'string' ? d.note : '',
      key: typeof d.key === 'string' && d.key ? d.key : newKey(),
    };
  } catch {
    return null;
  }
}

function writeDraft(storageKey: string, draft: Draft | null) {
  try {
    if (draft) localStorage.setItem(storageKey, JSON.stringify(draft));
    else localStorage.removeItem(storageKey);
  } catch {
    // Storage full or refused (a private window): the entry still stays in the form.
  }
}

const STAGE_DATES = ['sownOn', 'emergedOn', 'thinnedOn', 'transplantedOn', 'firstHarvestOn', 'lastHarvestOn', 'boltedOn'] as const;

/** The planting's dates with one stage changed, checked by the shared rules before anything is sent. */
function stageProblem(planting: PlantingDto, change: PlantingUpdateInput): string | null {
  const dates = Object.fromEntries(STAGE_DATES.map((f) => [f, planting[f]]));
  const checked = plantingUpdateSchema.safeParse({ ...dates, ...change });
  return checked.success ? null : (checked.error.issues[0]?.message ?? 'These dates do not fit together.');
}

/** The server's word for the field that was sent, else its first, else what happened in words. */
function saveProblem(error: unknown, field: string): string {
  if (error instanceof ApiError && Object.keys(error.fields).length) return error.fields[field] ?? Object.values(error.fields)[0];
  return mutationProblem(error);
}

/**
 * Tap what happened, tap save: today's date is filled in, amount and note are optional. What is
 * typed stays on this device until it is saved, so no connection, a reload or a closed tab loses
 * nothing; Try again sends the very same entry.
 */
export function QuickLog({ gardenId, planting, today, units }: { gardenId: number; planting: PlantingDto; today: string; units: DisplayUnit }) {
  const id = useId();
  const system = unitSystemOf(units);
  const storageKey = draftStorageKey(gardenId, planting.id);
  const add = useAddLogEntry(gardenId, planting.id);
  const update = useUpdatePlanting(gardenId, planting.id);
  const [draft, setDraftState] = useState<Draft | null>(() => readDraft(storageKey, system));
  const [restored, setRestored] = useState(() => draft !== null);
  const [problem, setProblem] = useState<{ message: string; retry: boolean } | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const pending = add.isPending || update.isPending;

  useEffect(() => writeDraft(storageKey, draft), [storageKey, draft]);

  const setDraft = (draft: Draft | null) => {
    setDraftState(draft);
    setRestored(false);
    setProblem(null);
  };
  /** A change to what is typed makes it another entry, with a key of its own. */
  const edit = (change: Partial<Omit<Draft, 'key' | 'kind'>>) => draft && setDraft({ ...draft, ...change, key: newKey() });

  const choose = (kind: QuickKind) => {
    setDone(null);
    if (draft?.kind === kind) return;
    const recorded = isStage(kind) ? planting[STAGE_FIELD[kind]] : null;
    setDraft({
      kind,
      entryOn: recorded ?? draft?.entryOn ?? today,
      amount: draft?.amount ?? '',
      unit: draft?.unit ?? AMOUNT_UNITS[system][0],
      note: draft?.note ?? '',
      key: newKey(),
    });
  };

  const failed = (error: unknown, field: string) =>
    setProblem({ message: saveProblem(error, field), retry: problemKind(error) !== 'answer' });

  // Promises rather than mutate()'s callbacks: these run even when the grower has left the page
  // meanwhile, so an entry that arrived is never left behind in storage to be sent twice.
  const succeeded = (sentKey: string, message: string) => {
    // Only the entry that was sent: another typed meanwhile (in a page opened again) stays.
    if (readDraft(storageKey, system)?.key === sentKey) writeDraft(storageKey, null);
    setDraftState((now) => (now && now.key !== sentKey ? now : null));
    setRestored(false);
    setProblem(null);
    setDone(message);
  };

  const save = () => {
    if (!draft || pending) return;
    setDone(null);
    setProblem(null);
    const { kind, entryOn } = draft;
    if (!entryOn) return setProblem({ message: 'Give the date.', retry: false });
    const when = formatDayInContext(entryOn, today);
    if (isStage(kind)) {
      const field = STAGE_FIELD[kind];
      // A planned planting that is sown or planted out is growing from then on.
      const startsIt = kind !== 'emerged' && planting.status === 'planned';
      const change: PlantingUpdateInput = { [field]: entryOn, ...(startsIt ? { status: 'growing' as const } : {}) };
      const wrong = stageProblem(planting, change);
      if (wrong) return setProblem({ message: wrong, retry: false });
      update.mutateAsync(change).then(() => succeeded(draft.key, `${kindWords(kind)} recorded for ${when}.`), (e: unknown) => failed(e, field));
      return;
    }
    const typed = kind === 'harvest' ? parseTypedNumber(draft.amount) : null;
    if (typed !== null && Number.isNaN(typed)) return setProblem({ message: 'Enter the amount as a number, for example 1.5.', retry: false });
    add
      .mutateAsync({
        entryOn,
        kind,
        ...(typed === null ? { amount: null, amountUnit: null } : amountToSend(typed, draft.unit)),
        note: draft.note,
        idempotencyKey: draft.key,
      })
      .then(
        () => succeeded(draft.key, `${kindWords(kind)} logged for ${when}.`),
        // No signal: the entry waits on this device with its key and is sent once it returns.
        (e: unknown) =>
          isNetworkError(e)
            ? enqueue({ id: draft.key, kind: 'log', gardenId, plantingId: planting.id, plantingName: `${planting.variety.name} in ${planting.bed.name}`, idempotencyKey: draft.key, body: { entryOn, kind, ...(typed === null ? { amount: null, amountUnit: null } : amountToSend(typed, draft.unit)), note: draft.note } }).then(
                () => succeeded(draft.key, `${kindWords(kind)} for ${when} is waiting to send — saved on this device.`),
                () => failed(e, 'entryOn'),
              )
            : failed(e, 'entryOn'),
      );
  };

  const recordedStages = (['sown', 'emerged', 'transplanted'] as const).filter((k) => planting[STAGE_FIELD[k]]);

  return (
    <section aria-labelledby={`${id}-h`} className="flex flex-col gap-3 rounded-lg border border-line bg-paper-raised p-4">
      <h2 id={`${id}-h`} className="text-lg font-bold">
        Add to the log
      </h2>
      <div className="grid grid-cols-3 gap-2" role="group" aria-label="What happened">
        {KINDS.map(({ kind: k, icon: Icon }) => {
          const recorded = isStage(k) ? planting[STAGE_FIELD[k]] : null;
          return (
            <button
              key={k}
              type="button"
              aria-pressed={draft?.kind === k}
              // Spoken as it reads: "Sown 14 Jun" (the date sits on its own line).
              aria-label={recorded ? `${kindWords(k)} ${formatDayInContext(recorded, today)}` : undefined}
              onClick={() => choose(k)}
              className="flex min-h-14 flex-col items-center justify-center gap-0.5 rounded-md border border-line bg-paper px-1 py-1 text-sm font-semibold aria-pressed:border-2 aria-pressed:border-leaf aria-pressed:bg-leaf-tint"
            >
              <Icon className="size-5" aria-hidden="true" />
              {kindWords(k)}
              {recorded && <span className="text-xs font-normal text-loam-soft">{formatDayInContext(recorded, today)}</span>}
            </button>
          );
        })}
      </div>
      <p className="text-sm text-loam-soft">
        {recordedStages.length
          ? `On record: ${recordedStages.map((k) => `${kindWords(k)} ${formatDayInContext(planting[STAGE_FIELD[k]]!, today)}`).join(' · ')}.`
          : 'No sowing, emergence or transplant date on record yet.'}
      </p>
      {draft && restored && !done && !problem && (
        <Notice tone="info" title="Not saved yet">
          Your “{kindWords(draft.kind)}” entry was kept on this device. Save it, or discard it.
        </Notice>
      )}
      {draft && (
        <div className="flex flex-col gap-3">
          {/* Still while it is being sent, so what is saved is what was on screen. */}
          <fieldset disabled={pending} className="grid gap-3 sm:grid-cols-3">
            <label className="flex flex-col gap-1">
              <span className="font-semibold">Date</span>
              <input type="date" value={draft.entryOn} max={today} onChange={(e) => edit({ entryOn: e.target.value })} className={CONTROL} />
            </label>
            {draft.kind === 'harvest' && (
              <div className="flex items-end gap-2">
                <label className="flex flex-1 flex-col gap-1">
                  <span className="font-semibold">Amount (optional)</span>
                  <input inputMode="decimal" value={draft.amount} onChange={(e) => edit({ amount: e.target.value })} className={CONTROL} />
                </label>
                <select aria-label="Amount unit" value={draft.unit} onChange={(e) => edit({ unit: e.target.value as AmountUnit })} className={`${CONTROL} w-auto`}>
                  {AMOUNT_UNITS[system].map((u) => (
                    <option key={u} value={u}>
                      {AMOUNT_UNIT_WORDS[u]}
                    </option>
                  ))}
                </select>
              </div>
            )}
            {!isStage(draft.kind) && (
              <label className="flex flex-col gap-1 sm:col-span-1">
                <span className="font-semibold">Note (optional)</span>
                <input value={draft.note} onChange={(e) => edit({ note: e.target.value })} className={CONTROL} />
              </label>
            )}
          </fieldset>
          {isStage(draft.kind) && planting[STAGE_FIELD[draft.kind]] && (
            <p className="text-sm text-loam-soft">
              {kindWords(draft.kind)} is on record for {formatDayInContext(planting[STAGE_FIELD[draft.kind]]!, today)}; saving another date changes it.
            </p>
          )}
          <div className="flex flex-wrap gap-2">
            <Button onClick={save} disabled={pending}>
              {pending ? 'Saving…' : `Save “${kindWords(draft.kind)}”`}
            </Button>
            <Button variant="quiet" onClick={() => setDraft(null)} disabled={pending}>
              Discard
            </Button>
          </div>
        </div>
      )}
      {problem && (
        <div className="flex flex-col items-start gap-2">
          <Notice tone="error" title="Not logged" live="alert">
            {problem.message}
          </Notice>
          {problem.retry && draft && (
            <Button variant="quiet" onClick={save} disabled={pending}>
              {pending ? 'Trying again…' : 'Try again'}
            </Button>
          )}
        </div>
      )}
      {done && (
        <Notice tone="success" live="status">
          {done}
        </Notice>
      )}
    </section>
  );
}
