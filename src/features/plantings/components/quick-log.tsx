import { useState } from 'react';
import { Droplets, Flower2, Leaf, NotebookPen, Scissors, ShoppingBasket } from 'lucide-react';
import { HARVEST_UNITS, HARVEST_UNIT_WORDS, LOG_KIND_WORDS } from '#shared/schemas/plantings';
import type { HarvestUnit, LogKind } from '#shared/schemas/plantings';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useAddLogEntry } from '@/features/plantings/api/add-log-entry';
import { CONTROL } from '@/features/plantings/components/field-styles';

const KINDS: { kind: LogKind; icon: typeof Leaf }[] = [
  { kind: 'watered', icon: Droplets },
  { kind: 'fed', icon: Leaf },
  { kind: 'thinned', icon: Scissors },
  { kind: 'harvest', icon: ShoppingBasket },
  { kind: 'bolted', icon: Flower2 },
  { kind: 'observation', icon: NotebookPen },
];

/** Tap what happened, tap save: today's date is filled in, amount and note are optional. */
export function QuickLog({ gardenId, plantingId, today }: { gardenId: number; plantingId: number; today: string }) {
  const add = useAddLogEntry(gardenId, plantingId);
  const [kind, setKind] = useState<LogKind | null>(null);
  const [entryOn, setEntryOn] = useState(today);
  const [amount, setAmount] = useState('');
  const [unit, setUnit] = useState<HarvestUnit>('kg');
  const [note, setNote] = useState('');
  const [done, setDone] = useState<string | null>(null);

  const save = () => {
    if (!kind) return;
    const amountValue = kind === 'harvest' && amount.trim() !== '' ? Number(amount) : null;
    add.mutate(
      { entryOn, kind, amount: amountValue, amountUnit: amountValue === null ? null : unit, note },
      {
        onSuccess: () => {
          setDone(`${LOG_KIND_WORDS[kind]} logged for ${entryOn}.`);
          setKind(null);
          setAmount('');
          setNote('');
        },
      },
    );
  };

  return (
    <section aria-labelledby="quick-log" className="flex flex-col gap-3 rounded-lg border border-line bg-paper-raised p-4">
      <h2 id="quick-log" className="text-lg font-bold">
        Add to the log
      </h2>
      <div className="grid grid-cols-3 gap-2 sm:grid-cols-6 lg:grid-cols-3" role="group" aria-label="What happened">
        {KINDS.map(({ kind: k, icon: Icon }) => (
          <button
            key={k}
            type="button"
            aria-pressed={kind === k}
            onClick={() => {
              setKind(k);
              setDone(null);
            }}
            className="flex min-h-14 flex-col items-center justify-center gap-1 rounded-md border border-line bg-paper px-1 text-sm font-semibold aria-pressed:border-2 aria-pressed:border-leaf aria-pressed:bg-leaf-tint"
          >
            <Icon className="size-5" aria-hidden="true" />
            {LOG_KIND_WORDS[k]}
          </button>
        ))}
      </div>
      {kind && (
        <div className="flex flex-col gap-3">
          <div className="grid gap-3 sm:grid-cols-3">
            <label className="flex flex-col gap-1">
              <span className="font-semibold">Date</span>
              <input type="date" value={entryOn} max={today} onChange={(e) => setEntryOn(e.target.value)} className={CONTROL} />
            </label>
            {kind === 'harvest' && (
              <div className="flex items-end gap-2">
                <label className="flex flex-1 flex-col gap-1">
                  <span className="font-semibold">Amount (optional)</span>
                  <input inputMode="decimal" value={amount} onChange={(e) => setAmount(e.target.value)} className={CONTROL} />
                </label>
                <select aria-label="Amount unit" value={unit} onChange={(e) => setUnit(e.target.value as HarvestUnit)} className={`${CONTROL} w-auto`}>
                  {HARVEST_UNITS.map((u) => (
                    <option key={u} value={u}>
                      {HARVEST_UNIT_WORDS[u]}
                    </option>
                  ))}
                </select>
              </div>
            )}
            <label className="flex flex-col gap-1 sm:col-span-1">
              <span className="font-semibold">Note (optional)</span>
              <input value={note} onChange={(e) => setNote(e.target.value)} className={CONTROL} />
            </label>
          </div>
          <div>
            <Button onClick={save} disabled={add.isPending}>
              {add.isPending ? 'Saving…' : `Save “${LOG_KIND_WORDS[kind]}”`}
            </Button>
          </div>
        </div>
      )}
      {add.isError && (
        <Notice tone="error" title="Not logged" live="alert">
          {Object.values((add.error as { fields?: Record<string, string> }).fields ?? {})[0] ?? add.error.message}
        </Notice>
      )}
      {done && (
        <Notice tone="success" live="status">
          {done}
        </Notice>
      )}
    </section>
  );
}
