import { CartesianGrid, Scatter, ScatterChart, Tooltip, XAxis, YAxis } from 'recharts';
import type { CompareDto } from '#shared/schemas/compare';
import { degreeDayUnit } from '@/lib/format';
import { seasonMark } from './season-marks';
import { chartPoints } from './chart-points';

const TICK = { fill: 'var(--color-loam)', fontSize: 12 };

/**
 * One mark per planting: across, the heat days it endured before bolting (or before its first
 * harvest when it did not bolt); up, the degree days to that day. Seasons differ by shape and
 * colour; axis text is dark loam on paper (well above 4.5:1). The table below holds every figure.
 */
export function CompareChart({ dto }: { dto: CompareDto }) {
  const ddUnit = degreeDayUnit(dto.unit);
  return (
    <figure className="w-full" aria-label={`Heat days and degree days of each ${dto.crop.name.toLowerCase()} planting, by season`}>
      <ScatterChart responsive margin={{ top: 16, right: 16, bottom: 24, left: 8 }} style={{ width: '100%', height: 'clamp(15rem, 50vw, 20rem)' }}>
        <CartesianGrid strokeDasharray="3 3" stroke="var(--color-line)" />
        <XAxis
          type="number"
          dataKey="heatDays"
          name="Heat days"
          allowDecimals={false}
          tick={TICK}
          label={{ value: 'Heat days before bolting or harvest', position: 'insideBottom', offset: -16, fill: 'var(--color-loam)', fontSize: 12 }}
        />
        <YAxis type="number" dataKey="degreeDays" name="Degree days" unit="" width={56} tick={TICK} label={{ value: ddUnit, angle: -90, position: 'insideLeft', fill: 'var(--color-loam)', fontSize: 12 }} />
        <Tooltip
          isAnimationActive={false}
          formatter={(value, name) => (name === 'Degree days' ? [`${String(value)} ${ddUnit}`, name] : [String(value), name])}
        />
        {dto.seasons.map((s, k) => {
          const mark = seasonMark(k);
          return <Scatter key={s.year} name={s.label} data={chartPoints(dto, s.year)} fill={mark.color} shape={mark.shape} isAnimationActive={false} />;
        })}
      </ScatterChart>
    </figure>
  );
}
