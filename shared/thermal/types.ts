import type { Cutoff, DegreeDayMethodName } from './degree-days';

export type TempSource = 'observed' | 'forecast' | 'imported' | 'filled';

/** One day's air temperatures in °C, as stored. */
export interface DailyTemp {
  date: string;
  tmax: number;
  tmin: number;
  source: TempSource;
}

/** How a planting's degree days are counted; thresholds in °C. */
export interface DegreeDayMethod {
  base: number;
  upper?: number;
  method: DegreeDayMethodName;
  cutoff?: Cutoff;
}

/** A percentile date triple; null where that share of scenarios never gets there. */
export interface DateWindow {
  p10: string | null;
  p50: string | null;
  p90: string | null;
}
