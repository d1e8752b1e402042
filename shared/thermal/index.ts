/**
 * Heatclock thermal engine: pure computation, no I/O, runs in the browser and on the server.
 * Temperatures are °C unless a function says otherwise; degree days follow the unit of the
 * temperatures and thresholds given (°C → °C-days). Dates are 'YYYY-MM-DD' strings.
 * Invalid input throws a RangeError naming the argument.
 *
 * Degree days
 *   dailyDegreeDays(tmax, tmin, { base, upper?, method, cutoff?, tminNext? }) → number
 *   accumulateDegreeDays(series: DailyTemp[], method: DegreeDayMethod, { start, end? })
 *     → { days: { date, dd, cumulative, source }[], missingDates, total, … }
 * Maturity
 *   projectMaturity({ start, target, method, observed, forecast?, history, latitude, cutoffDate?, maxDays? })
 *     → { accumulated, maturedOn, window: { p10, p50, p90 }, scenarios, neverMatureFraction, missingDates, skippedSeasons }
 *   degreeDayTargetFromDtm({ daysToMaturity, countsFrom, daysToEmergence?, history, method, window: { from: 'MM-DD', to } })
 *     → { target, countsFrom, days, p10, p90, samples }
 *   recalibrateTarget(prior, observedToHarvest[], priorWeight = 3) → { target, … }
 * Planning
 *   prepareSowingSweep({ history, latitude, method, triggers?, boltTolerance?, scoring?, frostThresholdC? }) → SweepClimatology
 *   sowingWindowSweep(climatology, { from, to, target, harvestWindowDays?, cutoff?, maxDays? }) → { candidates }
 *   seasonCandidates(date, latitude) → { from, to }
 * Bolting and stress
 *   assessBoltRisk({ start, days, latitude, triggers, method, target?, boltTolerance?, scoring? }) → { days, missingDates }
 *   firstHighBoltRiskDate(same input) → BoltRiskDay | null
 *   stressEvents(days, profile, thresholds?) → StressEvent[]
 *   BOLT_TRIGGER_DEFAULTS, STRESS_PROFILE_DEFAULTS (sourced, editable), boltTriggersOf(defaults)
 * Climate and calendar
 *   frostDates(history, latitude, { thresholdC?, minCoverage? }) → { seasons, lastSpring, firstFall, extremeMinimum }
 *   hardinessZone(averageAnnualExtremeMin, 'F' | 'C') → '6b'
 *   dayLengthHours(latitude, 'YYYY-MM-DD' | dayOfYear, { twilightDeg? }) → hours
 *   seasonOf(date, latitude) → { label, start, end, startYear }
 * Seeds
 *   germinationPercent(germinated, tested), seedsToSow(plantsWanted, germinationPercent, emergenceFactor = 1)
 *   emergenceDays(cropKey, soilC) → { days, betweenF, interpolated } | null (Harrington & Minges table)
 *   soilSowing({ cropKey, germMinC, germOptC, germMaxC }, soilC) → { status, emergence }
 */
export { dailyDegreeDays } from './degree-days';
export type { Cutoff, DegreeDayMethodName, DegreeDayOptions } from './degree-days';
export type { DailyTemp, DateWindow, DegreeDayMethod, TempSource } from './types';
export { accumulateDegreeDays } from './series';
export type { Accumulation, AccumulatedDay } from './series';
export { projectMaturity } from './projection';
export type { MaturityProjection, MaturityProjectionInput, ScenarioResult } from './projection';
export { degreeDayTargetFromDtm, recalibrateTarget } from './targets';
export type { DtmCountsFrom, DtmTarget, DtmTargetInput, RecalibratedTarget } from './targets';
export { prepareSowingSweep, sowingWindowSweep, seasonCandidates } from './sowing-sweep';
export type { SowingCandidate, SowingSweep, SweepClimatology, SweepCutoff, SweepOptions, SweepPreparationInput } from './sowing-sweep';
export { assessBoltRisk, firstHighBoltRiskDate, DEFAULT_BOLT_SCORING } from './bolt-risk';
export type {
  BoltReason,
  BoltRiskAssessment,
  BoltRiskDay,
  BoltRiskInput,
  BoltRiskLevel,
  BoltScoring,
  BoltTrigger,
  BoltTriggers,
  VernalizationTrigger,
} from './bolt-risk';
export { stressEvents, STRESS_THRESHOLDS_F, FROST_SEVERITIES_BY_CLASS } from './stress';
export type {
  BlossomDropProfile,
  FrostSeverity,
  HardinessClass,
  PollinationHeatProfile,
  StressEvent,
  StressKind,
  StressProfile,
  StressSeverity,
  StressThresholdsF,
} from './stress';
export { BOLT_TRIGGER_DEFAULTS, STRESS_PROFILE_DEFAULTS, boltTriggersOf } from './crop-defaults';
export type { Confidence, CropBoltDefaults, CropStressDefaults, Sourced } from './crop-defaults';
export { frostDates } from './frost-dates';
export type { ExtremeMinimum, FrostDateOptions, FrostDates, FrostQuantile, FrostWindow, SeasonFrost } from './frost-dates';
export { hardinessZone } from './hardiness';
export { dayLengthHours } from './day-length';
export type { DayLengthOptions } from './day-length';
export { seasonOf } from './season';
export type { Season } from './season';
export { addDays, dayOfYear, daysBetween } from './dates';
export { isSouthern } from './season';
export { germinationPercent, seedsToSow } from './seeds';
export { cToF, fToC, cDeltaToF, fDeltaToC, cDaysToFDays, fDaysToCDays } from './units';
export { CHILL_HOUR_MAX_C, chillOfHours, chillSeasonOf, estimatedHours, isChillHour, linvillHours, utahWeight } from './chill';
export type { ChillTotals } from './chill';
export { EMERGENCE_DAYS, EMERGENCE_SOURCE, EMERGENCE_TEMPS_F, emergenceDays, soilSowing } from './emergence';
export type { Emergence, SoilSowing, SoilSowingInput, SoilSowingStatus } from './emergence';
