import type { ReactNode } from 'react';
import type { MaturityDto, ProgressDto, StressDto } from '#shared/schemas/progress';
import { formatDayMonth, formatDayWindow, formatDegreeDays, formatHeat, formatPercent, formatTemp } from '@/lib/format';
import { BoltRiskLabel } from '@/components/ui/bolt-risk-label';
import { SEVERITY_WORDS, START_WORDS, STRESS_LOOK } from '@/features/progress/utils/progress-words';

function Fact({ term, children }: { term: string; children: ReactNode }) {
  return (
    <div className="flex flex-col gap-0.5 py-2 sm:grid sm:grid-cols-[11rem_1fr] sm:gap-4">
      <dt className="font-semibold">{term}</dt>
      <dd className="min-w-0 break-words">{children}</dd>
    </div>
  );
}

function readyWords(maturity: MaturityDto, recorded: ProgressDto['recorded']): string {
  const { p10, p50, p90, basis } = maturity;
  if (basis.kind === 'recorded') {
    const on = recorded.firstHarvestOn ?? p50;
    return on ? `First harvest on record ${formatDayMonth(on)}` : 'A harvest is on record';
  }
  if (basis.kind === 'none' || !p50) return 'No maturity window yet';
  if (basis.kind === 'observed') return `Target reached ${formatDayMonth(p50)}`;
  return `Likely ready ${formatDayWindow(p10 ?? p50, p90 ?? p50)} (middle estimate ${formatDayMonth(p50)})`;
}

function StressItem({ stress: s, unit }: { stress: StressDto; unit: ProgressDto['unit'] }) {
  const { words, icon: Icon } = STRESS_LOOK[s.kind];
  const extreme = s.lowestMin !== null ? `low ${formatTemp(s.lowestMin, unit)}` : s.highestMax !== null ? `high ${formatTemp(s.highestMax, unit)}` : null;
  return (
    <li className="flex gap-2">
      <Icon className="mt-0.5 size-4 shrink-0" aria-hidden="true" />
      <span>
        <span className="font-semibold">
          {words}, {SEVERITY_WORDS[s.severity]}
        </span>{' '}
        {formatDayWindow(s.start, s.end)}
        {s.forecast ? ' (forecast)' : ''}: {s.message}
        {extreme && ` (${extreme}; threshold ${formatTemp(s.threshold, unit)})`}
      </span>
    </li>
  );
}

/** The chart in words, for everyone: the server's sentence and the facts behind it, each with its unit. */
export function ProgressSummary({ progress: p }: { progress: ProgressDto }) {
  const coming = p.stress.filter((s) => s.forecast);
  const past = p.stress.filter((s) => !s.forecast);
  const share = p.maturity.basis.neverMatureShare;
  return (
    <section aria-labelledby="progress-summary" className="flex flex-col gap-2">
      <h3 id="progress-summary" className="font-bold">In words</h3>
      <p>{p.summary}</p>
      <dl className="divide-y divide-line">
        <Fact term="Heat so far">
          {formatHeat(p.accumulated, p.target, p.percent, p.unit)}
          {p.startEvent && `, counted from ${START_WORDS[p.startEvent.kind]} on ${formatDayMonth(p.startEvent.on)}`}
        </Fact>
        <Fact term="Target">
          {p.target === null ? 'No degree-day target. ' : `${formatDegreeDays(p.target, p.unit)}. `}
          {p.targetNote}
        </Fact>
        <Fact term="Ready">
          <p>{readyWords(p.maturity, p.recorded)}</p>
          <p className="text-loam-soft">{p.maturity.basis.note}</p>
          {share > 0 && <p className="text-loam-soft">{formatPercent(share * 100)} of past seasons did not reach the target within a year.</p>}
        </Fact>
        {p.packetDate && <Fact term="Packet date">{formatDayMonth(p.packetDate)}</Fact>}
        {p.recorded.boltedOn && <Fact term="Bolted">{formatDayMonth(p.recorded.boltedOn)}</Fact>}
        <Fact term="Bolt risk">
          <BoltRiskLabel level={p.boltRisk.level} highFrom={p.boltRisk.highFrom} />
          {p.boltRisk.note && <p className="text-loam-soft">{p.boltRisk.note}</p>}
          {p.boltRisk.reasons.length > 0 && (
            <ul className="mt-1 list-disc pl-5">
              {p.boltRisk.reasons.map((r) => (
                <li key={`${r.trigger}-${r.message}`}>
                  {r.message}
                </li>
              ))}
            </ul>
          )}
        </Fact>
        <Fact term="Stress in the forecast">
          {coming.length ? (
            <ul className="flex flex-col gap-1">
              {coming.map((s) => <StressItem key={`${s.kind}-${s.start}`} stress={s} unit={p.unit} />)}
            </ul>
          ) : (
            'None in the forecast.'
          )}
        </Fact>
        {past.length > 0 && (
          <Fact term="Stress so far">
            <ul className="flex flex-col gap-1">
              {past.map((s) => <StressItem key={`${s.kind}-${s.start}`} stress={s} unit={p.unit} />)}
            </ul>
          </Fact>
        )}
        {p.missingDates.length > 0 && (
          <Fact term="Days without readings">
            {p.missingDates.length} since the start ({p.missingDates.map(formatDayMonth).join(', ')}). They add no degree days; nothing is guessed for them.
          </Fact>
        )}
      </dl>
    </section>
  );
}
