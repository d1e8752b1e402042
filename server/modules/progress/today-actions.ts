/**
 * What needs a grower's attention first on Today, from the plantings' progress: bolt risk turning
 * high, stress in the forecast, harvest windows that have opened. Advice is plain words; where
 * the work itself can hurt someone (heat, frost heaters), the usual caution goes with it.
 */
import type { DisplayUnit } from '#shared/schemas/gardens';
import type { TodayActionDto, TodayPlantingDto } from '#shared/schemas/progress';
import { addDays } from '#shared/thermal/dates';
import { dayMonth, dayRange } from '#shared/format/day-words';
import { stressTitle } from './progress.presenter';

/** How far ahead a projected high bolt risk is worth acting on now. */
const BOLT_LOOKAHEAD_DAYS = 7;

const HEAT_CAUTION = 'When you work outdoors in the heat, drink water often, rest in the shade and follow local heat-safety advice.';
const FROST_CAUTION = 'If you use a heater for frost protection, follow its label and local fire codes, keep fuel away from plants and people, and never run a fuel-burning heater in a closed space.';

const ADVICE = {
  bolt: 'Harvest what is near size now; shade and water it through the heat; for the next sowing, choose a slower-bolting variety or sow where it gets afternoon shade.',
  frost: `Cover them overnight with row cover or a sheet, water the soil the afternoon before, and bring containers in. ${FROST_CAUTION}`,
  chilling: 'Cover them at night or move containers somewhere sheltered; warm-season crops stall and can be injured in a run of cold nights.',
  heat: `Water deeply early in the day and shade them through the hottest hours. ${HEAT_CAUTION}`,
  window: 'Check it for size and taste: the degree-day window for harvest has opened.',
} as const;

const label = (p: TodayPlantingDto) => `${p.crop.name}: ${p.variety.name} (${p.bed.name})`;

function boltActions(plantings: TodayPlantingDto[], today: string): TodayActionDto[] {
  const horizon = addDays(today, BOLT_LOOKAHEAD_DAYS);
  return plantings.flatMap((p) => {
    const g = p.progress;
    if (!(g.boltLevel === 'high' || (g.boltHighFrom && g.boltHighFrom <= horizon))) return [];
    const now = g.boltLevel === 'high';
    return [{ kind: 'bolt-high' as const, plantingId: p.plantingId, plantingIds: [p.plantingId], title: `${label(p)}: bolt risk high ${now ? 'now' : `from ${dayMonth(g.boltHighFrom!)}`}`, advice: ADVICE.bolt, detail: g.boltReason ?? g.summary, date: now ? today : g.boltHighFrom }];
  });
}

/** One action per forecast event, naming every planting it touches: a frost night is one thing to act on. */
function stressActions(plantings: TodayPlantingDto[]): TodayActionDto[] {
  const events = new Map<string, { kind: TodayPlantingDto['progress']['stress'][number]['kind']; title: string; start: string; message: string; plantings: TodayPlantingDto[] }>();
  for (const p of plantings) {
    for (const s of p.progress.stress) {
      const key = `${s.kind}:${s.severity}:${s.start}`;
      const e = events.get(key) ?? { kind: s.kind, title: stressTitle(s), start: s.start, message: s.message, plantings: [] };
      e.plantings.push(p);
      events.set(key, e);
    }
  }
  return [...events.values()].map((e) => {
    const advice = e.kind === 'frost' ? ADVICE.frost : e.kind === 'chilling' ? ADVICE.chilling : ADVICE.heat;
    const who = e.plantings.length === 1 ? label(e.plantings[0]) : `${e.plantings.length} plantings`;
    const names = e.plantings.length > 1 ? ` (${e.plantings.map((p) => `${p.crop.name}: ${p.variety.name}`).join(', ')})` : '';
    const title = `${e.title.charAt(0).toUpperCase()}${e.title.slice(1)} forecast ${dayMonth(e.start)} for ${who}`;
    return { kind: 'stress' as const, stressKind: e.kind, plantingId: e.plantings[0].plantingId, plantingIds: e.plantings.map((p) => p.plantingId), title, advice, detail: `${e.message}${names}.`, date: e.start };
  });
}

function windowActions(plantings: TodayPlantingDto[], today: string, unit: DisplayUnit): TodayActionDto[] {
  return plantings.flatMap((p) => {
    const g = p.progress;
    const m = g.maturity;
    if (!m.p10 || m.p10 > today || m.kind === 'recorded' || m.kind === 'none') return [];
    const range = m.p90 && m.p90 !== m.p10 ? `likely ready ${dayRange(m.p10, m.p90)}` : `ready from ${dayMonth(m.p10)}`;
    const heat = g.target ? `${Math.round(g.accumulated)} of ${Math.round(g.target)} °${unit}-days (${Math.round(g.percent ?? 0)} %)` : `${Math.round(g.accumulated)} °${unit}-days`;
    return [{ kind: 'window-open' as const, plantingId: p.plantingId, plantingIds: [p.plantingId], title: `${label(p)}: harvest window open`, advice: ADVICE.window, detail: `${heat}; ${range}.`, date: m.p10 }];
  });
}

export function todayActions(plantings: TodayPlantingDto[], today: string, unit: DisplayUnit): TodayActionDto[] {
  const byDate = (a: TodayActionDto, b: TodayActionDto) => (a.date ?? '').localeCompare(b.date ?? '');
  return [...boltActions(plantings, today).sort(byDate), ...stressActions(plantings).sort(byDate), ...windowActions(plantings, today, unit).sort(byDate)];
}
