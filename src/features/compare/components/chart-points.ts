import type { CompareDto } from '#shared/schemas/compare';

export interface ChartPoint {
  plantingId: number;
  variety: string;
  heatDays: number;
  degreeDays: number;
  until: 'bolting' | 'harvest';
}

/** Plantings that can be placed: heat days counted, and degree days to the same event. */
export function chartPoints(dto: CompareDto, seasonYear: number | null): ChartPoint[] {
  const names = new Map(dto.varieties.map((v) => [v.varietyId, v.name]));
  return dto.plantings.flatMap((p) => {
    if (p.season !== seasonYear || p.heatDays === null) return [];
    const dd = p.heatUntil === 'bolt' ? p.ddToBolt : p.ddToHarvest;
    if (dd === null) return [];
    return [{ plantingId: p.plantingId, variety: names.get(p.varietyId) ?? '', heatDays: p.heatDays, degreeDays: dd, until: p.heatUntil === 'bolt' ? ('bolting' as const) : ('harvest' as const) }];
  });
}
