import type { DisplayUnit } from '#shared/schemas/gardens';
import { formatDegreeDays, formatTemp, formatWeekdayDayMonth, SOURCE_WORDS } from '@/lib/format';
import type { ProgressPoint } from '@/features/progress/utils/progress-points';

interface TooltipProps {
  active?: boolean;
  payload?: ReadonlyArray<{ payload?: unknown }>;
  unit: DisplayUnit;
}

const BOX = 'rounded-md border border-line bg-paper-raised px-3 py-2 text-sm text-loam shadow-sm';

/** Degree days of the hovered day: the record so far, and the projection's spread where there is one. */
export function HeatTooltip({ active, payload, unit }: TooltipProps) {
  const point = payload?.[0]?.payload as ProgressPoint | undefined;
  if (!active || !point) return null;
  const recorded = point.observed ?? point.forecast;
  return (
    <div className={BOX}>
      <p className="font-semibold">{formatWeekdayDayMonth(point.date)}</p>
      {recorded !== null && (
        <p>
          {point.observed !== null ? 'So far' : 'With the forecast'}: {formatDegreeDays(recorded, unit)}
        </p>
      )}
      {point.band && point.median !== null && (
        <p>
          Projected {formatDegreeDays(point.band[0], unit)} to {formatDegreeDays(point.band[1], unit)} (middle {formatDegreeDays(point.median, unit)})
        </p>
      )}
      {recorded === null && !point.band && <p>No figures for this day</p>}
    </div>
  );
}

/** The hovered day's high, low, degree days and where the readings come from. */
export function TemperatureTooltip({ active, payload, unit }: TooltipProps) {
  const point = payload?.[0]?.payload as ProgressPoint | undefined;
  if (!active || !point) return null;
  const { day } = point;
  return (
    <div className={BOX}>
      <p className="font-semibold">{formatWeekdayDayMonth(point.date)}</p>
      {day ? (
        <>
          <p>
            High {formatTemp(day.tmax, unit)} · Low {formatTemp(day.tmin, unit)}
          </p>
          <p>{formatDegreeDays(day.dd, unit, 1)} that day</p>
          <p className="text-loam-soft">{SOURCE_WORDS[day.source]}</p>
        </>
      ) : (
        <p>No reading for this day</p>
      )}
    </div>
  );
}
