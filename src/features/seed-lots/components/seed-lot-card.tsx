import { useRef, useState } from 'react';
import { CircleCheck, CircleHelp, Hourglass, TriangleAlert, FlaskConical, Pencil } from 'lucide-react';
import type { GerminationTestDto, SeedLotDto, ViabilityStatus } from '#shared/schemas/seed-lots';
import { Button } from '@/components/ui/button';
import { ConfirmDelete } from '@/components/ui/confirm-delete';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { loadProblem, mutationProblem } from '@/lib/problems';
import { FieldError } from '@/components/ui/text-field';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { useAddGerminationTest } from '@/features/seed-lots/api/add-germination-test';
import { useDeleteGerminationTest } from '@/features/seed-lots/api/delete-germination-test';
import { useDeleteSeedLot } from '@/features/seed-lots/api/delete-seed-lot';
import { useSeedLot } from '@/features/seed-lots/api/get-seed-lot';
import { useSeedsToSow } from '@/features/seed-lots/api/get-seeds-to-sow';
import { SeedLotForm } from '@/features/seed-lots/components/seed-lot-form';
import { formatDayInContext, formatFullDate } from '@/lib/format';

const VIABILITY: Record<ViabilityStatus, { word: string; icon: typeof CircleCheck }> = {
  tested: { word: 'Tested', icon: FlaskConical },
  fresh: { word: 'Fresh', icon: CircleCheck },
  ageing: { word: 'Ageing', icon: Hourglass },
  'past-seed-life': { word: 'Past seed life', icon: TriangleAlert },
  unknown: { word: 'Unknown age', icon: CircleHelp },
};
const INPUT = 'min-h-11 w-full rounded-md border border-line bg-paper px-3';

function GerminationTestForm({ gardenId, lotId, today }: { gardenId: number; lotId: number; today: string }) {
  const add = useAddGerminationTest(gardenId, lotId);
  const submission = useSubmissionKey();
  // Set at once on submit: the mutation's own pending state reaches the button a moment later.
  const sending = useRef(false);
  const [testedOn, setTestedOn] = useState(today);
  const [tested, setTested] = useState('20');
  const [germinated, setGerminated] = useState('');
  const fields = (add.error as { fields?: Record<string, string> } | null)?.fields ?? {};
  return (
    <form
      className="grid grid-cols-3 items-end gap-2"
      aria-label="Record a germination test"
      onSubmit={(e) => {
        e.preventDefault();
        if (sending.current) return;
        sending.current = true;
        const entry = { testedOn, seedsTested: Number(tested), germinated: Number(germinated) };
        add.mutate(
          { ...entry, idempotencyKey: submission.keyFor(entry) },
          {
            onSuccess: () => {
              submission.renew();
              setGerminated('');
            },
            onSettled: () => {
              sending.current = false;
            },
          },
        );
      }}
    >
      <label className="flex flex-col gap-1 text-sm"><span className="font-semibold">Tested on</span><input type="date" className={INPUT} value={testedOn} onChange={(e) => setTestedOn(e.target.value)} /></label>
      <label className="flex flex-col gap-1 text-sm"><span className="font-semibold">Seeds tested</span><input inputMode="numeric" className={INPUT} value={tested} onChange={(e) => setTested(e.target.value)} /></label>
      <label className="flex flex-col gap-1 text-sm"><span className="font-semibold">Germinated</span><input inputMode="numeric" className={INPUT} value={germinated} onChange={(e) => setGerminated(e.target.value)} /></label>
      <div className="col-span-3 flex flex-wrap items-center gap-2">
        <Button type="submit" variant="quiet" disabled={add.isPending || germinated === ''}>Save test</Button>
        {Object.values(fields).map((m) => <FieldError key={m}>{m}</FieldError>)}
        {add.isError && !Object.keys(fields).length && <FieldError>{mutationProblem(add.error)}</FieldError>}
      </div>
    </form>
  );
}

function SeedsToSow({ gardenId, lot }: { gardenId: number; lot: SeedLotDto }) {
  const [plants, setPlants] = useState('100');
  const [emergence, setEmergence] = useState('80');
  const p = Number(plants);
  const f = Number(emergence) / 100;
  const valid = Number.isInteger(p) && p >= 1 && f > 0 && f <= 1;
  const result = useSeedsToSow(gardenId, lot.id, p, f, valid && lot.latestTest !== null);
  if (!lot.latestTest) return <p className="text-sm text-loam-soft">Record a germination test to work out how many seeds to sow.</p>;
  return (
    <div className="grid grid-cols-2 items-end gap-2 text-sm">
      <label className="flex flex-col gap-1"><span className="font-semibold">Plants wanted</span><input inputMode="numeric" className={INPUT} value={plants} onChange={(e) => setPlants(e.target.value)} /></label>
      <label className="flex flex-col gap-1"><span className="font-semibold">Field emergence, %</span><input inputMode="numeric" className={INPUT} value={emergence} onChange={(e) => setEmergence(e.target.value)} /></label>
      <p className="col-span-2" role="status">
        {!valid ? 'Enter a whole number of plants and an emergence from 1 to 100 %.' : result.data ? (
          <>Sow <strong>{result.data.seeds} seeds</strong> ({result.data.germinationPercent.toFixed(0)} % germination in the test of {formatFullDate(result.data.basedOn.testedOn)}, {emergence} % field emergence).</>
        ) : result.isError ? loadProblem(result.error) : 'Working it out…'}
      </p>
    </div>
  );
}

function TestRow({ gardenId, lotId, test: t }: { gardenId: number; lotId: number; test: GerminationTestDto }) {
  const remove = useDeleteGerminationTest(gardenId, lotId, t.id);
  const on = formatFullDate(t.testedOn);
  return (
    <li className="flex flex-wrap items-center justify-between gap-2 py-1">
      <span>
        <time dateTime={t.testedOn}>{on}</time>: {Math.round(t.percent)} % ({t.germinated} of {t.seedsTested} seeds)
        {t.notes && ` · ${t.notes}`}
      </span>
      <ConfirmDelete
        compact
        label={`Delete the germination test of ${on}`}
        question={`Delete the test of ${on}?`}
        consequence="Its counts are removed for good; the lot’s viability and seeds to sow then follow the test before it, if any."
        confirmLabel="Delete test"
        onConfirm={() => remove.mutate()}
        pending={remove.isPending}
        error={remove.error}
      />
    </li>
  );
}

/** Every test of the lot, which only the single-lot answer carries; fetched once the panel opens. */
function GerminationTests({ gardenId, lotId }: { gardenId: number; lotId: number }) {
  const lot = useSeedLot(gardenId, lotId);
  if (lot.isPending) return <Loading label="Loading the tests…" />;
  if (lot.isError) return <LoadProblem compact error={lot.error} what="the tests" onRetry={() => lot.refetch()} retrying={lot.isFetching} />;
  const tests = lot.data.tests ?? [];
  if (!tests.length) return <p className="text-sm text-loam-soft">No germination tests yet.</p>;
  return (
    <section aria-label="Germination tests" className="text-sm">
      <h3 className="font-semibold">Germination tests</h3>
      <ul className="divide-y divide-line">
        {tests.map((t) => <TestRow key={t.id} gardenId={gardenId} lotId={lotId} test={t} />)}
      </ul>
    </section>
  );
}

export function SeedLotCard({
  gardenId,
  lot,
  canEdit,
  today,
  varieties,
}: {
  gardenId: number;
  lot: SeedLotDto;
  canEdit: boolean;
  today: string;
  /** Choices for the variety when editing. */
  varieties: { id: number; label: string }[];
}) {
  const [editing, setEditing] = useState(false);
  const [open, setOpen] = useState(false);
  const remove = useDeleteSeedLot(gardenId, lot.id);
  if (editing) return <SeedLotForm gardenId={gardenId} varieties={varieties} lot={lot} onSaved={() => setEditing(false)} onCancel={() => setEditing(false)} />;
  const v = VIABILITY[lot.viability.status];
  const Icon = v.icon;
  const title = `${lot.variety.name}${lot.lotNumber ? ` lot ${lot.lotNumber}` : ''}`;
  return (
    <article className="flex flex-col gap-3 rounded-lg border border-line bg-paper-raised p-4">
      <header>
        <h2 className="text-lg font-bold">{lot.variety.cropName}: {lot.variety.name}</h2>
        <p className="text-sm text-loam-soft">
          {[lot.lotNumber && `Lot ${lot.lotNumber}`, lot.supplier, lot.packedForYear && `packed for ${lot.packedForYear}`].filter(Boolean).join(' · ') || 'Unlabelled lot'}
        </p>
      </header>
      <p className="text-sm">
        Quantity: {lot.quantity === null ? '—' : `${lot.quantity} ${lot.quantityUnit === 'grams' ? 'g' : 'seeds'}`}
        {lot.latestTest && ` · Last test: ${Math.round(lot.latestTest.percent)} % (${lot.latestTest.germinated} of ${lot.latestTest.seedsTested}) on ${formatDayInContext(lot.latestTest.testedOn, today)}`}
      </p>
      <p className="flex gap-2 rounded-md bg-paper-sunk px-3 py-2 text-sm">
        <Icon className="size-4 shrink-0" aria-hidden="true" />
        <span><span className="font-semibold">{v.word}:</span> {lot.viability.message}</span>
      </p>
      {lot.variety.traits.includes('treated') && (
        <p className="flex gap-2 rounded-md border-l-4 border-ember bg-ember-tint px-3 py-2 text-sm">
          <TriangleAlert className="size-4 shrink-0" aria-hidden="true" />
          <span><span className="font-semibold">Caution:</span> treated seed. Wear gloves, keep it from children, animals and feed, and follow the packet label.</span>
        </p>
      )}
      <details onToggle={(e) => setOpen(e.currentTarget.open)}>
        <summary className="min-h-11 cursor-pointer py-2 font-semibold">Seeds to sow and germination tests</summary>
        {open && (
          <div className="flex flex-col gap-3">
            <SeedsToSow gardenId={gardenId} lot={lot} />
            <GerminationTests gardenId={gardenId} lotId={lot.id} />
            {canEdit && <GerminationTestForm gardenId={gardenId} lotId={lot.id} today={today} />}
          </div>
        )}
      </details>
      {canEdit && (
        <div className="flex flex-wrap gap-2 border-t border-line pt-3">
          <Button variant="quiet" aria-label={`Edit seed lot ${title}`} onClick={() => setEditing(true)}>
            <Pencil className="size-5" aria-hidden="true" /> Edit
          </Button>
          <ConfirmDelete
            label={`Delete seed lot ${title}`}
            question={`Delete this seed lot of ${lot.variety.name}?`}
            consequence="The lot’s details and all its germination tests are removed for good. A lot that plantings were sown from cannot be deleted: they keep it on record."
            confirmLabel="Delete seed lot"
            onConfirm={() => remove.mutate()}
            pending={remove.isPending}
            error={remove.error}
          />
        </div>
      )}
    </article>
  );
}
