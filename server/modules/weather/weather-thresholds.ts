/**
 * Reference lines for the weather chart: the base temperature, upper threshold and bolting heat
 * threshold of every crop with a planting in the ground (bolting heat only for crops that bolt),
 * with this garden's overrides applied.
 * Crops sharing a value share one line, so the chart names them together.
 */
import type { DisplayUnit } from '#shared/schemas/gardens';
import type { WeatherThresholdDto } from '#shared/schemas/weather';
import { findCrop } from '#shared/crops/library';
import { cToF } from '#shared/thermal/units';
import { Planting, Variety } from '../../db/models';
import { effectiveCrops } from '../crops/crops.service';

const KINDS = [
  { kind: 'base', param: 'baseC', words: 'Base temperature' },
  { kind: 'upper', param: 'upperC', words: 'Upper threshold' },
  { kind: 'bolt-heat', param: 'boltHeatThresholdC', words: 'Bolting heat' },
] as const;

export async function activeThresholds(gardenId: number, unit: DisplayUnit): Promise<WeatherThresholdDto[]> {
  const growing = await Planting.findAll({
    where: { gardenId, status: 'growing' },
    include: [{ model: Variety, as: 'variety', attributes: ['cropKey'], required: true }],
    attributes: ['id'],
  });
  const cropKeys = [...new Set(growing.map((p) => (p as Planting & { variety: Variety }).variety.cropKey))].sort();
  if (!cropKeys.length) return [];
  const crops = await effectiveCrops(gardenId);
  const lines = new Map<string, { kind: WeatherThresholdDto['kind']; words: string; valueC: number; names: string[] }>();
  for (const key of cropKeys) {
    const values = crops.get(key);
    if (!values) continue;
    const crop = findCrop(key);
    const name = crop?.name ?? key;
    for (const k of KINDS) {
      // A crop that does not bolt (peas, warm-season crops) has no bolting heat to draw.
      if (k.kind === 'bolt-heat' && !crop?.bolts) continue;
      const v = values[k.param];
      if (typeof v !== 'number') continue;
      const id = `${k.kind}:${v}`;
      const line = lines.get(id) ?? { kind: k.kind, words: k.words, valueC: v, names: [] };
      line.names.push(name);
      lines.set(id, line);
    }
  }
  const show = (c: number) => Math.round((unit === 'F' ? cToF(c) : c) * 10) / 10;
  return [...lines.values()]
    .sort((a, b) => a.valueC - b.valueC)
    .map((l) => ({ kind: l.kind, value: show(l.valueC), label: `${l.words} – ${l.names.join(', ')}` }));
}
