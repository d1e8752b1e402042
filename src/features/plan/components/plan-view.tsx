import { useId } from 'react';
import type { PlanDto } from '#shared/schemas/plan';
import { lazyPart } from '@/lib/lazy-part';
import { formatDayMonth, formatDayWindow } from '@/lib/format';

// Recharts is large: it loads with this component, in its own chunk, only when a plan is shown.
const PlanChart = lazyPart(() => import('@/features/plan/components/plan-chart').then((m) => m.PlanChart), {
  loading: 'Drawing the chart…',
  failed: 'The chart could not be loaded',
});

function FrostLine({ plan }: { plan: PlanDto }) {
  const { lastSpring, firstFall, seasons } = plan.frost;
  if (!seasons) return null;
  const spring = lastSpring ? `last spring frost ${formatDayMonth(lastSpring)}` : 'no spring frost';
  const autumn = firstFall ? `first autumn frost ${formatDayMonth(firstFall)}` : 'no autumn frost';
  return <p className="mt-3">{`At this frost risk: ${spring}, ${autumn} (from ${seasons} past ${seasons === 1 ? 'season' : 'seasons'}).`}</p>;
}

export function PlanView({ plan }: { plan: PlanDto }) {
  // Two plans can be on the page side by side: each labels its own sections.
  const id = useId();
  return (
    <div className="min-w-0 space-y-5">
      <section aria-labelledby={`${id}-windows`}>
        <h2 id={`${id}-windows`} className="text-lg font-semibold">
          When to {plan.startKind === 'transplant' ? 'set out' : 'sow'} {plan.variety.name}, {plan.season.label}
        </h2>
        {plan.windows.length ? (
          <ul className="mt-2 space-y-2">
            {plan.windows.map((w) => (
              <li key={w.from}>
                <strong>{w.name}</strong>: {w.reason}
              </li>
            ))}
          </ul>
        ) : (
          <p className="mt-2">{plan.summary}</p>
        )}
        {plan.succession && <p className="mt-3">{plan.succession.words}</p>}
        <FrostLine plan={plan} />
        {plan.excluded.length > 0 && (
          <>
            <h3 className="mt-4 font-semibold">Left out</h3>
            <ul className="mt-1 list-disc space-y-1 pl-5">
              {plan.excluded.map((e) => <li key={e.from}>{e.reason}</li>)}
            </ul>
          </>
        )}
      </section>
      {plan.candidates.length > 0 && (
        <section aria-labelledby={`${id}-chart`}>
          <h2 id={`${id}-chart`} className="text-lg font-semibold">
            {plan.variety.name} across the season
          </h2>
          <p className="text-sm">Bars: share of past years (%) with high bolt risk while ready to pick, for each start day. Green bands: the recommended windows.</p>
          <PlanChart plan={plan} />
          <details className="mt-2">
            <summary>Table of start days</summary>
            <div className="overflow-x-auto">
              <table className="mt-2 w-full text-sm">
                <thead>
                  <tr>
                    <th scope="col" className="text-left">Start</th>
                    <th scope="col" className="text-left">Ready (1 in 10 – 9 in 10 years)</th>
                    <th scope="col" className="text-left">High bolt risk</th>
                    <th scope="col" className="text-left">Recommended</th>
                  </tr>
                </thead>
                <tbody>
                  {plan.candidates.map((c) => (
                    <tr key={c.sowOn}>
                      <td>{formatDayMonth(c.sowOn)}</td>
                      <td>{c.harvest.p10 && c.harvest.p90 ? formatDayWindow(c.harvest.p10, c.harvest.p90) : 'not every year'}</td>
                      <td>{Math.round(c.boltHighShare * c.years)} of {c.years} years</td>
                      <td>{c.recommended ? 'yes' : `no: ${c.reason}`}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          </details>
        </section>
      )}
      <p className="text-sm">{plan.method}</p>
    </div>
  );
}
