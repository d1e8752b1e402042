import type { AlertDto } from '#shared/schemas/alerts';
import type { ClimateDto } from '#shared/schemas/climate';
import type { UserDto } from '#shared/schemas/auth';
import type { GardenDto } from '#shared/schemas/gardens';
import type { BedDto } from '#shared/schemas/beds';
import type { CropDto, CropParamDto } from '#shared/schemas/crops';
import type { PlantingDto } from '#shared/schemas/plantings';
import type { BoltLevel, ProgressDto, ProgressProjectionDay, ProgressSeriesDay, ProgressSummaryDto, TodayDto } from '#shared/schemas/progress';

// Invented test people and places, in the spirit of the demo scenario.
export const grower: UserDto = { id: 7, email: 'mara@example.org', name: 'Mara Quill' };

export function aGarden(overrides: Partial<GardenDto> = {}): GardenDto {
  return {
    id: 1,
    name: 'Hollowbrook Teaching Garden',
    latitude: 44.52,
    longitude: -72.81,
    elevationM: 210,
    timeZone: 'America/New_York',
    units: 'F',
    hemisphere: 'N',
    role: 'owner',
    ...overrides,
  };
}

export function aPlanting(overrides: Partial<PlantingDto> = {}): PlantingDto {
  return {
    id: 5,
    bed: { id: 3, name: 'North 1' },
    variety: { id: 7, name: 'Copperleaf Butterhead', dtmDays: 55, dtmFrom: 'sowing', boltTolerance: 3 },
    crop: { key: 'lettuce', name: 'Lettuce', season: 'cool' },
    seedLot: { id: 11, label: 'Lot HC-01001' },
    method: 'direct-sow',
    status: 'growing',
    quantity: 24,
    quantityUnit: 'plants',
    sownOn: '2025-04-02',
    emergedOn: '2025-04-10',
    thinnedOn: null,
    transplantedOn: null,
    firstHarvestOn: null,
    lastHarvestOn: null,
    boltedOn: null,
    notes: 'Under the row cover.',
    season: '2025',
    nextEvent: { label: 'First harvest', on: '2025-05-27', basis: '55 days from sowing' },
    logCount: 14,
    attention: { overdue: null, stale: null },
    ...overrides,
  };
}

export function aBed(overrides: Partial<BedDto> = {}): BedDto {
  return { id: 3, name: 'North 1', kind: 'raised-bed', lengthM: 2.4, widthM: 1.2, areaM2: 2.88, notes: '', activePlantings: 2, plantingsOnRecord: 5, ...overrides };
}

/** A crop with a few of its parameters, enough for the library page. */
export function aCrop(params: CropParamDto[], overrides: Partial<CropDto> = {}): CropDto {
  return {
    key: 'lettuce',
    name: 'Lettuce',
    botanicalName: 'Lactuca sativa',
    season: 'cool',
    overrides: params.filter((p) => p.origin === 'garden').length,
    params,
    ...overrides,
  };
}

export function aParam(overrides: Partial<CropParamDto> = {}): CropParamDto {
  return {
    key: 'baseC',
    label: 'Base temperature',
    group: 'Degree days',
    kind: 'number',
    unit: 'C',
    value: 4.4,
    source: 'Extension bulletin (invented for tests)',
    confidence: 'M',
    origin: 'library',
    libraryDefault: null,
    updatedAt: null,
    ...overrides,
  };
}

/** Consecutive 'YYYY-MM-DD' days from `from`, `count` of them (UTC calendar arithmetic). */
function daysFrom(from: string, count: number): string[] {
  const start = Date.parse(`${from}T00:00:00Z`);
  return Array.from({ length: count }, (_, k) => new Date(start + k * 86_400_000).toISOString().slice(0, 10));
}

/**
 * A butterhead lettuce sown 1 May 2025 in a °F garden, on 2 June: 32 observed days adding up to
 * 412 °F-days (28 days of 13 and 4 of 12), 11 forecast days of 16, then the analog projection.
 */
export function aProgress(overrides: Partial<ProgressDto> = {}): ProgressDto {
  let cumulative = 0;
  const series: ProgressSeriesDay[] = daysFrom('2025-05-01', 43).map((date, k) => {
    const forecast = k >= 32;
    const dd = forecast ? 16 : k < 28 ? 13 : 12;
    cumulative += dd;
    return { date, tmax: 62 + (k % 5) * 2 + (forecast ? 6 : 0), tmin: 44 + (k % 3), dd, cumulative, source: forecast ? 'forecast' : 'observed' };
  });
  const projection: ProgressProjectionDay[] = daysFrom('2025-06-13', 18).map((date, k) => ({
    date,
    p10: 590 + k * 14,
    p50: 590 + k * 19,
    p90: 590 + k * 25,
  }));
  const boltDays = daysFrom('2025-05-01', 43).map((date, k) => ({
    date,
    level: (k < 25 ? 'low' : k < 39 ? 'elevated' : 'high') as BoltLevel,
    forecast: k >= 32,
  }));
  return {
    plantingId: 5,
    status: 'growing',
    unit: 'F',
    method: 'direct-sow',
    base: 40,
    upper: 80,
    cutoff: 'horizontal',
    target: 950,
    targetBasis: 'packet',
    targetNote: 'From the packet’s 55 days to maturity over this garden’s past seasons.',
    accumulated: 412,
    percent: 43,
    startEvent: { kind: 'sowing', on: '2025-05-01' },
    packetDate: '2025-06-12',
    maturity: {
      p10: '2025-06-14',
      p50: '2025-06-18',
      p90: '2025-06-22',
      basis: {
        kind: 'analog',
        observedDays: 32,
        forecastDays: 11,
        analogYears: 10,
        neverMatureShare: 0,
        note: '32 recorded days and 11 forecast days, then 10 past seasons of this garden.',
      },
    },
    boltRisk: {
      note: null,
      level: 'elevated',
      reasons: [
        { trigger: 'heat', message: '4 days above 80.0 °F in a row are forecast.', forecast: true },
        { trigger: 'day-length', message: 'Days are longer than 14 h 30 min.', forecast: false },
      ],
      highFrom: '2025-06-09',
      days: boltDays,
    },
    stress: [
      {
        kind: 'blossom-drop',
        severity: 'watch',
        start: '2025-06-10',
        end: '2025-06-11',
        days: 2,
        forecast: true,
        lowestMin: null,
        highestMax: 91.4,
        threshold: 90,
        message: 'Heat above 90.0 °F is forecast.',
      },
    ],
    series,
    projection,
    today: '2025-06-02',
    missingDates: [],
    recorded: { firstHarvestOn: null, boltedOn: null },
    summary: '412 of 950 °F-days (43 %); likely ready 14–22 June; bolt risk high from 9 June.',
    ...overrides,
  };
}

/** Spinach in the southern °C garden, sown 20 July 2025, seen on 1 September. */
export function aCelsiusProgress(overrides: Partial<ProgressDto> = {}): ProgressDto {
  const series: ProgressSeriesDay[] = daysFrom('2025-08-30', 3).map((date, k) => ({
    date,
    tmax: 14.5 + k,
    tmin: -1.5 + k,
    dd: 5.5,
    cumulative: 222.5 + 5.5 * (k + 1),
    source: k === 2 ? 'forecast' : 'observed',
  }));
  return aProgress({
    plantingId: 8,
    unit: 'C',
    base: 2,
    upper: 24,
    target: 520,
    targetNote: 'Calibrated from 3 harvests of this variety in this garden.',
    targetBasis: 'calibrated',
    accumulated: 233.5,
    percent: 45,
    startEvent: { kind: 'sowing', on: '2025-07-20' },
    packetDate: '2025-10-05',
    maturity: {
      p10: '2025-10-03',
      p50: '2025-10-07',
      p90: '2025-10-11',
      basis: { kind: 'analog', observedDays: 42, forecastDays: 1, analogYears: 9, neverMatureShare: 0.1, note: '42 recorded days, 1 forecast day, then 9 past seasons.' },
    },
    boltRisk: {
      note: null,
      level: 'low',
      reasons: [{ trigger: 'day-length', message: 'Days are still shorter than 14 h.', forecast: false }],
      highFrom: null,
      days: series.map((d) => ({ date: d.date, level: 'low', forecast: d.source === 'forecast' })),
    },
    stress: [
      {
        kind: 'frost',
        severity: 'light',
        start: '2025-09-01',
        end: '2025-09-01',
        days: 1,
        forecast: true,
        lowestMin: -1.5,
        highestMax: null,
        threshold: 0,
        message: 'A light frost is forecast.',
      },
    ],
    series,
    projection: daysFrom('2025-09-02', 3).map((date, k) => ({ date, p10: 236 + k * 4, p50: 238 + k * 5, p90: 240 + k * 6 })),
    today: '2025-09-01',
    missingDates: ['2025-08-12'],
    summary: '234 of 520 °C-days (45 %); likely ready 3–11 October.',
    ...overrides,
  });
}

export function aProgressSummary(overrides: Partial<ProgressSummaryDto> = {}): ProgressSummaryDto {
  return {
    plantingId: 5,
    unit: 'F',
    accumulated: 412,
    target: 950,
    percent: 43,
    maturity: { p10: '2025-06-14', p50: '2025-06-18', p90: '2025-06-22', kind: 'analog' },
    boltLevel: 'elevated',
    boltHighFrom: '2025-06-09',
    boltReason: '4 days above 80.0 °F in a row are forecast.',
    boltRiskFrom: '2025-06-07',
    boltReasons: ['4 days above 80.0 °F in a row are forecast.'],
    stress: [],
    summary: '412 of 950 °F-days (43 %); likely ready 14–22 June.',
    ...overrides,
  };
}

export function aToday(overrides: Partial<TodayDto> = {}): TodayDto {
  const t: Omit<TodayDto, 'actionsTotal' | 'growingTotal'> & Partial<TodayDto> = {
    today: '2025-06-02',
    unit: 'F',
    actions: [
      {
        kind: 'window-open',
        alertId: 41,
        caution: null,
        plantingId: 9,
        plantingIds: [9],
        title: 'Radish: Ember Globe is ready to pull',
        advice: 'Harvest in the cool of the morning.',
        detail: '402 of 390 °F-days (103 %)',
        date: '2025-06-02',
      },
      {
        kind: 'bolt-high',
        alertId: 42,
        caution: 'When you work outdoors in the heat, drink water often, rest in the shade and follow local heat-safety advice.',
        plantingId: 5,
        plantingIds: [5],
        title: 'Lettuce: Copperleaf Butterhead may bolt',
        advice: 'Harvest early or shade the bed; keep it watered.',
        detail: 'Highs of 84–88 °F for 4 days from 9 Jun',
        date: '2025-06-09',
      },
    ],
    plantings: [
      {
        plantingId: 5,
        crop: { key: 'lettuce', name: 'Lettuce', season: 'cool' },
        variety: { id: 7, name: 'Copperleaf Butterhead' },
        bed: { id: 3, name: 'North 1' },
        status: 'growing',
        attention: { overdue: null, stale: null },
        progress: aProgressSummary(),
      },
      {
        plantingId: 9,
        crop: { key: 'radish', name: 'Radish', season: 'cool' },
        variety: { id: 12, name: 'Ember Globe' },
        bed: { id: 4, name: 'North 2' },
        status: 'growing',
        attention: { overdue: null, stale: null },
        progress: aProgressSummary({
          plantingId: 9,
          accumulated: 402,
          target: 390,
          percent: 103,
          maturity: { p10: '2025-05-31', p50: '2025-05-31', p90: '2025-05-31', kind: 'observed' },
          boltLevel: 'low',
          boltHighFrom: null,
          boltReason: null,
        }),
      },
    ],
    weather: daysFrom('2025-05-26', 14).map((date, k) => ({
      date,
      tmax: 70 + k,
      tmin: 48 + (k % 4),
      source: k < 7 ? 'observed' : 'forecast',
    })),
    ...overrides,
  };
  return { ...t, actionsTotal: t.actionsTotal ?? t.actions.length, growingTotal: t.growingTotal ?? t.plantings.length };
}

/** An open bolt-risk alert for the butterhead lettuce in North 1 (planting 5), raised on 2 June 2025. */
export function anAlert(overrides: Partial<AlertDto> = {}): AlertDto {
  return {
    id: 42,
    gardenId: 1,
    type: 'bolt-risk',
    severity: 'warning',
    status: 'open',
    plantingId: 5,
    subject: 'Lettuce: Copperleaf Butterhead (North 1)',
    title: 'Bolt risk high from 9 Jun',
    startsOn: '2025-06-09',
    endsOn: '2025-06-12',
    reasons: ['4 days ≥ 80 °F forecast 9–12 Jun', 'Day length 15.1 h'],
    action: 'Harvest early or shade the bed, and keep it watered.',
    caution: 'Working outdoors in the heat: drink water often and rest in the shade.',
    createdAt: '2025-06-02T11:00:00.000Z',
    updatedAt: '2025-06-02T11:00:00.000Z',
    acknowledgedAt: null,
    acknowledgedBy: null,
    resolvedAt: null,
    ...overrides,
  };
}

/** A garden's climate facts; by default a garden with no stored weather yet. */
export function aClimate(overrides: Partial<ClimateDto> = {}): ClimateDto {
  const none = { p10: null, p50: null, p90: null, years: 0, estimate: true };
  return {
    years: 0,
    estimate: true,
    hemisphere: 'north',
    reason: 'No weather is stored for this garden yet.',
    lastSpringFrost: none,
    firstFallFrost: none,
    frostFreeDays: none,
    extremeMinimum: { mean: null, unit: 'F', years: 0, estimate: true },
    zone: { zone: null, years: 0, estimate: true },
    override: null,
    source: 'history',
    ...overrides,
  };
}
