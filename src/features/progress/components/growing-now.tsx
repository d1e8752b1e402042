import { AttentionFlags } from '@/components/ui/attention-flags';
import { Link } from 'react-router-dom';
import type { TodayDto } from '#shared/schemas/progress';
import { formatReady } from '@/lib/format';
import { BoltRiskLabel } from '@/components/ui/bolt-risk-label';
import { ProgressMeter } from '@/components/ui/progress-meter';

/** Active plantings with their heat so far, ready window and bolt risk, each in words. */
export function GrowingNow({ gardenId, today }: { gardenId: number; today: TodayDto }) {
  if (!today.plantings.length) {
    return (
      <p>
        No plantings are growing. Plantings show here with their progress once they are sown or transplanted;{' '}
        <Link to={`/g/${gardenId}/plantings`} className="font-semibold text-frost underline">
          see all plantings
        </Link>
        .
      </p>
    );
  }
  const more = today.growingTotal > today.plantings.length;
  return (
    <>
      {more && (
        <p>
          The {today.plantings.length.toLocaleString()} that need you soonest (highest bolt risk first, then the nearest harvest) of{' '}
          {today.growingTotal.toLocaleString()} growing plantings.{' '}
          <Link to={`/g/${gardenId}/plantings`} className="font-semibold text-frost underline">
            See every planting
          </Link>
          .
        </p>
      )}
      <ul className="flex flex-col divide-y divide-line rounded-lg border border-line bg-paper-raised">
        {today.plantings.map((p) => {
          const name = `${p.crop.name}: ${p.variety.name}`;
          return (
            <li key={p.plantingId} className="grid gap-2 p-3 sm:grid-cols-[minmax(0,14rem)_minmax(0,1fr)_auto] sm:items-center sm:gap-4 sm:p-4">
              <div className="min-w-0">
                <Link to={`/g/${gardenId}/plantings/${p.plantingId}`} className="font-semibold break-words underline">
                  {name}
                </Link>
                <p className="text-sm text-loam-soft">{p.bed.name}</p>
                <AttentionFlags attention={p.attention} />
              </div>
              <div className="flex min-w-0 flex-col gap-1">
                <ProgressMeter label={`Heat toward maturity of ${name}`} accumulated={p.progress.accumulated} target={p.progress.target} percent={p.progress.percent} unit={today.unit} />
                <p className="text-sm">{formatReady(p.progress.maturity)}</p>
              </div>
              <div className="flex flex-col items-start gap-1 sm:items-end">
                <BoltRiskLabel level={p.progress.boltLevel} highFrom={p.progress.boltHighFrom} prefix="Bolt risk: " />
                {p.progress.boltReason && <p className="text-sm text-loam-soft sm:text-right">{p.progress.boltReason}</p>}
              </div>
            </li>
          );
        })}
      </ul>
    </>
  );
}
