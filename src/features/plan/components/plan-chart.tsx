import { Bar, BarChart, CartesianGrid, ReferenceArea, XAxis, YAxis } from 'recharts';
import type { PlanDto } from '#shared/schemas/plan';
import { formatDayMonth } from '@/lib/format';

const TICK = { fill: 'var(--color-loam)', fontSize: 12 };

/**
 * One bar per start day: the share of past years with high bolt risk while ready to pick. The
 * recommended windows are bands behind the bars, named in dark text on their light tint (well
 * above 4.5:1). The page gives the same figures as a table and the windows in words.
 */
export function PlanChart({ plan }: { plan: PlanDto }) {
  const data = plan.candidates.map((c) => ({ sowOn: c.sowOn, bolt: Math.round(c.boltHighShare * 100) }));
  const onAxis = (date: string) => plan.candidates.find((c) => c.sowOn >= date)?.sowOn ?? plan.candidates.at(-1)?.sowOn;
  return (
    <figure className="w-full" aria-label={`Start days of ${plan.season.label}: bolt risk at harvest and recommended windows`}>
      <BarChart responsive data={data} margin={{ top: 24, right: 8, bottom: 8, left: 0 }} style={{ width: '100%', height: 'clamp(14rem, 40vw, 18rem)' }}>
        <CartesianGrid strokeDasharray="3 3" stroke="var(--color-line)" vertical={false} />
        {plan.windows.map((w) => (
          <ReferenceArea
            key={w.from}
            x1={onAxis(w.from)}
            x2={onAxis(w.to)}
            fill="var(--color-leaf-tint)"
            fillOpacity={1}
            label={{ value: w.name, position: 'insideTop', fill: 'var(--color-loam)', fontSize: 12 }}
          />
        ))}
        <XAxis dataKey="sowOn" tickFormatter={formatDayMonth} tick={TICK} interval="preserveStartEnd" minTickGap={24} />
        <YAxis domain={[0, 100]} unit=" %" width={48} tick={TICK} />
        <Bar dataKey="bolt" name="Past years with high bolt risk at harvest" fill="var(--color-ember)" isAnimationActive={false} />
      </BarChart>
    </figure>
  );
}
