import { useState } from 'react';
import { countOf } from '#shared/format/count-words';
import { formatDegreeDays, formatFullDate } from '@/lib/format';
import { mutationProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { useCalibration } from '@/features/varieties/api/get-calibration';
import { useUpdateVariety } from '@/features/varieties/api/update-variety';

/**
 * The degree days this garden's own harvests of a variety took, beside the packet's target; a
 * grower can adopt their median as the variety's target (progress, alerts and plans then use it).
 */
export function CalibrationPanel({ gardenId, varietyId, varietyName, canEdit }: { gardenId: number; varietyId: number; varietyName: string; canEdit: boolean }) {
  const [open, setOpen] = useState(false);
  const calibration = useCalibration(gardenId, varietyId, open);
  const adopt = useUpdateVariety(gardenId, varietyId);
  const c = calibration.data;
  return (
    <details className="text-sm" onToggle={(e) => setOpen(e.currentTarget.open)}>
      <summary className="min-h-11 cursor-pointer content-center font-semibold">From your harvests of {varietyName}</summary>
      <div className="flex flex-col gap-2 pb-2">
        {calibration.isPending && open && <Loading label="Adding up your harvests…" />}
        {calibration.isError && <LoadProblem compact error={calibration.error} what="your harvests" onRetry={() => calibration.refetch()} retrying={calibration.isFetching} />}
        {c && c.median === null && <p>{c.caution}</p>}
        {c && c.median !== null && (
          <>
            <p>
              Your harvests took a median of <strong>{formatDegreeDays(c.median, c.unit)}</strong> from the start to the first picking ({countOf(c.count, 'harvest')}
              {c.p25 !== null && c.p75 !== null && c.count >= 4 ? `; the middle half took ${formatDegreeDays(c.p25, c.unit)} to ${formatDegreeDays(c.p75, c.unit)}` : `; from ${formatDegreeDays(c.min!, c.unit)} to ${formatDegreeDays(c.max!, c.unit)}`}).
            </p>
            {c.caution && <p className="font-semibold">{c.caution}</p>}
            {c.unmeasured > 0 && <p className="text-loam-soft">{countOf(c.unmeasured, 'harvest')} could not be measured: no start date or days without weather before it.</p>}
            <ul className="list-disc pl-5">
              {c.harvests.slice(0, 8).map((h) => (
                <li key={h.plantingId}>
                  Started {formatFullDate(h.startOn)}, first picked {formatFullDate(h.firstHarvestOn)}: {formatDegreeDays(h.degreeDays, c.unit)} in {countOf(h.days, 'day')}
                </li>
              ))}
            </ul>
            {canEdit && c.medianC !== null && (
              <Button variant="quiet" className="self-start" disabled={adopt.isPending} onClick={() => adopt.mutate({ gddTargetOverrideC: c.medianC })}>
                {adopt.isPending ? 'Saving…' : `Use ${formatDegreeDays(c.median, c.unit)} as this variety’s target`}
              </Button>
            )}
            {adopt.isSuccess && (
              <Notice tone="success" live="status">
                Saved: plantings of {varietyName} now count toward {formatDegreeDays(c.median, c.unit)}.
              </Notice>
            )}
            {adopt.isError && (
              <Notice tone="error" live="alert">
                {mutationProblem(adopt.error)}
              </Notice>
            )}
          </>
        )}
      </div>
    </details>
  );
}
