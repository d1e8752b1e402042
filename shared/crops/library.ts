/**
 * The shared crop library: defaults for every garden, each value with its source and confidence
 * as graded in SCIENCE.md. Bolt triggers and heat/cold stress profiles come from the thermal
 * engine's own sourced defaults (shared/thermal/crop-defaults.ts), so they are never kept twice;
 * this file adds base/upper temperatures (§2), hardiness where the engine has none (§4),
 * germination temperatures and seed life (§7) and sowing depth and spacing (common practice).
 * Temperatures are °C; figures published in °F are converted exactly.
 */
import { BOLT_TRIGGER_DEFAULTS, STRESS_PROFILE_DEFAULTS, fToC } from '../thermal/index';
import type { CropBoltDefaults, CropStressDefaults, VernalizationTrigger } from '../thermal/index';
import type { Confidence, CropDefinition, CropParams, ParamValue, Sourced } from './params';

const at = <T>(value: T, confidence: Confidence, source: string): Sourced<T> => ({ value, source, confidence });

const SRC = {
  delaware: 'Univ. of Delaware Weekly Crop Update: base 40 °F (4.4 °C) for peas, lettuce and cole crops',
  coolDefault: 'Extension default for cool-season crops, base 40 °F (4.4 °C) (from memory)',
  warmDefault: 'Extension default for warm-season crops, base 50 °F (10 °C) (from memory)',
  upper86: 'Extension default upper threshold 86 °F (30 °C) for warm-season crops (from memory)',
  noUpper: 'Base-40 °F practice for cool-season crops sets no upper threshold (Heatclock default)',
  method: 'Heatclock default: single sine, horizontal cutoff (Baskerville & Emin 1969; Zalom et al. 1983, UC DANR Leaflet 21373)',
  cornMethod: 'Modified corn heat units, 50/86 °F clamped average: AMS glossary; Ohio State Ext. AGF-101',
  coolSeason: 'Cool-season crop: Univ. of Delaware; MSU Ext. "Bolting in spring vegetables"',
  warmSeason: 'Warm-season crop: Purdue HO-203 (from Illinois VC-14)',
  hardiness: 'Purdue HO-203 (from Illinois VC-14) planting hardiness classes',
  germ: 'Harrington, Oregon State Ext.: germination soil temperatures',
  germCole: 'Harrington, Oregon State Ext.: cabbage figures applied to this cole crop',
  germNone: 'Not in Harrington’s table; set your own if you know it',
  seedLife: 'Iowa State Ext. 1999, from Knott’s Handbook for Vegetable Growers (years under good storage)',
  seedLifeNone: 'Not in the Iowa State / Knott’s list; set your own if you know it',
  practice: 'Common practice (from memory, no source read)',
  noBolt: 'No bolt trigger in the library defaults',
  notBolting: 'Not a bolting crop within its garden season',
  biennial: 'Biennial vernalized by cold (≈4–10 °C) after a juvenile phase (SCIENCE §3, M); no figures read for days or the juvenile gate',
  noStress: 'No figure in the library defaults',
  chill: 'SCIENCE §4: chilling injury of warm-season crops below ~50 °F (M)',
  noChill: 'Cool-season crop: no chilling injury in the garden range',
} as const;

interface Base {
  key: string;
  name: string;
  botanicalName: string;
  /** Key of the thermal engine's bolt/stress defaults, when it differs from ours. */
  engineKey?: string;
  season: 'cool' | 'warm';
  base: Sourced<number>;
  upper?: Sourced<number | null>;
  method?: Sourced<ParamValue<'method'>>;
  hardiness: ParamValue<'hardiness'>;
  hardinessSource?: Sourced<unknown>;
  /** Germination soil temperatures min/opt/max in °F as published; null when not in the table. */
  germF: [number, number, number] | null;
  germSource?: string;
  seedLife: number | null;
  seedLifeSource?: string;
  depthCm: number;
  spacingCm: number;
  /** A qualitative bolting note for crops without engine trigger figures. */
  boltNote?: string;
  /** Set false for a cool-season crop that does not bolt (its heat trigger means something else). */
  bolts?: false;
}

const coolBase = (value: number, confidence: Confidence, source: string) => at(value, confidence, source);

const BASES: Base[] = [
  { key: 'lettuce', name: 'Lettuce', botanicalName: 'Lactuca sativa', season: 'cool', base: coolBase(fToC(40), 'H', SRC.delaware), hardiness: 'very-hardy', germF: [35, 75, 85], germSource: `${SRC.germ}; maximum given as 85–95 °F, lower end kept`, seedLife: 6, depthCm: 0.5, spacingCm: 25 },
  { key: 'spinach', name: 'Spinach', botanicalName: 'Spinacia oleracea', season: 'cool', base: coolBase(fToC(40), 'L', SRC.coolDefault), hardiness: 'very-hardy', germF: [35, 70, 85], seedLife: 3, depthCm: 1.5, spacingCm: 8 },
  { key: 'arugula', name: 'Arugula', botanicalName: 'Eruca vesicaria subsp. sativa', season: 'cool', base: coolBase(fToC(40), 'L', SRC.coolDefault), hardiness: 'frost-tolerant', hardinessSource: at(null, 'from memory', 'Not in Purdue HO-203’s list; class from memory'), germF: null, seedLife: null, depthCm: 0.5, spacingCm: 10 },
  { key: 'cilantro', name: 'Cilantro', botanicalName: 'Coriandrum sativum', season: 'cool', base: coolBase(fToC(40), 'L', SRC.coolDefault), hardiness: 'frost-tolerant', hardinessSource: at(null, 'from memory', 'Not in Purdue HO-203’s list; class from memory'), germF: null, seedLife: null, depthCm: 1, spacingCm: 15 },
  { key: 'radish', name: 'Radish', botanicalName: 'Raphanus sativus', season: 'cool', base: coolBase(fToC(40), 'L', SRC.coolDefault), hardiness: 'frost-tolerant', germF: [40, 85, 95], seedLife: 5, depthCm: 1.2, spacingCm: 4 },
  { key: 'pea', name: 'Pea', botanicalName: 'Pisum sativum', season: 'cool', base: coolBase(fToC(40), 'H', `${SRC.delaware}; fastest varieties harvested at ≈1,250 base-40 °F GDD`), hardiness: 'very-hardy', germF: [40, 75, 85], seedLife: 3, depthCm: 2.5, spacingCm: 5, bolts: false },
  { key: 'bok-choy', engineKey: 'bok choy', name: 'Bok choy', botanicalName: 'Brassica rapa subsp. chinensis', season: 'cool', base: coolBase(fToC(40), 'M', `${SRC.delaware} (cole crop figure applied)`), hardiness: 'frost-tolerant', germF: [40, 85, 100], germSource: SRC.germCole, seedLife: 3, seedLifeSource: `${SRC.seedLife}: Chinese cabbage figure`, depthCm: 1, spacingCm: 20 },
  { key: 'broccoli', name: 'Broccoli', botanicalName: 'Brassica oleracea var. italica', season: 'cool', base: coolBase(0, 'H', 'Tan et al. 2000, Scientia Horticulturae 84:227'), hardiness: 'frost-tolerant', germF: [40, 85, 100], germSource: SRC.germCole, seedLife: 3, depthCm: 1.2, spacingCm: 45, boltNote: SRC.biennial },
  { key: 'cabbage', name: 'Cabbage', botanicalName: 'Brassica oleracea var. capitata', season: 'cool', base: coolBase(fToC(40), 'L', `${SRC.coolDefault}; Univ. of Delaware uses base 40 °F for cole crops`), hardiness: 'frost-tolerant', germF: [40, 85, 100], seedLife: 4, depthCm: 1.2, spacingCm: 45 },
  { key: 'carrot', name: 'Carrot', botanicalName: 'Daucus carota subsp. sativus', season: 'cool', base: coolBase(4, 'M', 'Zhao et al. 2019, SIMPLE crop model'), hardiness: 'frost-tolerant', germF: [40, 80, 95], seedLife: 3, depthCm: 0.6, spacingCm: 5, boltNote: SRC.biennial },
  { key: 'beet', name: 'Beet', botanicalName: 'Beta vulgaris', season: 'cool', base: coolBase(fToC(40), 'L', SRC.coolDefault), hardiness: 'frost-tolerant', germF: [40, 85, 95], seedLife: 4, depthCm: 1.5, spacingCm: 8, boltNote: SRC.biennial },
  { key: 'onion', name: 'Onion', botanicalName: 'Allium cepa', season: 'cool', base: coolBase(fToC(40), 'L', SRC.coolDefault), hardiness: 'very-hardy', germF: [35, 75, 95], seedLife: 1, depthCm: 1.2, spacingCm: 10, boltNote: `${SRC.biennial}; onion is sensitive from ≈5 leaves` },
  { key: 'tomato', name: 'Tomato', botanicalName: 'Solanum lycopersicum', season: 'warm', base: at(10, 'M', 'Zalom & Wilson 1999: California processing tomato models, 10 °C with a delay when Tx > 30 °C'), upper: at(30, 'M', 'Zalom & Wilson 1999: development delayed when Tx > 30 °C'), hardiness: 'tender', germF: [50, 85, 95], seedLife: 4, depthCm: 0.6, spacingCm: 60 },
  { key: 'pepper', name: 'Pepper', botanicalName: 'Capsicum annuum', season: 'warm', base: at(10, 'L', SRC.warmDefault), hardiness: 'warm-loving', germF: [60, 85, 95], seedLife: 2, depthCm: 0.6, spacingCm: 45 },
  { key: 'snap-bean', engineKey: 'bean', name: 'Snap bean', botanicalName: 'Phaseolus vulgaris', season: 'warm', base: at(10, 'M', 'High Plains Regional Climate Center: dry bean 50/86 °F (applied to snap bean)'), upper: at(30, 'M', 'High Plains Regional Climate Center: dry bean 50/86 °F (applied to snap bean)'), hardiness: 'tender', germF: [60, 80, 95], seedLife: 3, depthCm: 2.5, spacingCm: 8 },
  { key: 'sweet-corn', engineKey: 'sweet corn', name: 'Sweet corn', botanicalName: 'Zea mays convar. saccharata', season: 'warm', base: at(10, 'H', 'Oregon State Ext., Andrews, Noordijk & Coop 2016: sweet corn 50/86 °F'), upper: at(30, 'H', 'Oregon State Ext., Andrews, Noordijk & Coop 2016: sweet corn 50/86 °F'), method: at('clamped-average', 'H', SRC.cornMethod), hardiness: 'tender', germF: [50, 95, 105], seedLife: 2, depthCm: 4, spacingCm: 25 },
  { key: 'cucumber', name: 'Cucumber', botanicalName: 'Cucumis sativus', season: 'warm', base: at(10, 'L', `${SRC.warmDefault}; Perry & Wehner 1996 (HortTechnology 6(1):27) publish a cucumber-specific variant`), hardiness: 'warm-loving', germF: [60, 95, 105], seedLife: 5, depthCm: 2.5, spacingCm: 30 },
  { key: 'squash', name: 'Squash', botanicalName: 'Cucurbita spp.', season: 'warm', base: at(10, 'L', SRC.warmDefault), hardiness: 'warm-loving', germF: [60, 95, 100], seedLife: 4, depthCm: 2.5, spacingCm: 90 },
  { key: 'watermelon', name: 'Watermelon', botanicalName: 'Citrullus lanatus', season: 'warm', base: at(10, 'L', SRC.warmDefault), hardiness: 'warm-loving', germF: [60, 95, 105], seedLife: 4, depthCm: 2.5, spacingCm: 90 },
];

function boltParams(b: Base, defaults: CropBoltDefaults | undefined) {
  const none = (key: string) => at<number | null>(null, 'L', b.season === 'warm' ? SRC.notBolting : key);
  const fallback = b.boltNote ?? SRC.noBolt;
  const t = defaults?.triggers ?? {};
  const note = defaults?.note ? `. ${defaults.note}` : '';
  const from = (s: Sourced<number | undefined> | undefined) =>
    s && s.value !== undefined ? at<number | null>(s.value, s.confidence, s.source + note) : none(fallback);
  const v = t.vernalization;
  const vern = (pick: (x: VernalizationTrigger) => number) => (v?.value ? at<number | null>(pick(v.value), v.confidence, v.source) : none(fallback));
  return {
    boltHeatThresholdC: from(t.heatThresholdC),
    boltHeatStreakDays: t.heatThresholdC ? from(t.heatStreakDays) : none(fallback),
    criticalPhotoperiodH: from(t.criticalPhotoperiodH),
    twilightAllowanceH: t.criticalPhotoperiodH ? from(t.twilightAllowanceH) : none(fallback),
    vernalizationMinC: vern((x) => x.minC),
    vernalizationMaxC: vern((x) => x.maxC),
    vernalizationDays: vern((x) => x.requiredDays),
    juvenileGdd: vern((x) => x.juvenileGdd),
  };
}

function stressParams(b: Base, defaults: CropStressDefaults | undefined) {
  const p = defaults?.profile;
  const s = defaults?.sources ?? {};
  const hardinessSource = s.hardiness ?? b.hardinessSource ?? { source: SRC.hardiness, confidence: 'M' as const };
  const none = () => at<number | null>(null, 'L', SRC.noStress);
  const bd = p?.blossomDrop;
  const bds = s.blossomDrop;
  const blossom = (pick: (x: NonNullable<typeof bd>) => number, temp: boolean) =>
    bd && bds ? at<number | null>(temp ? fToC(pick(bd)) : pick(bd), bds.confidence, bds.source) : none();
  const ph = p?.pollinationHeat;
  const phs = s.pollinationHeat;
  const chilling = p?.chillingSensitive ?? b.season === 'warm';
  const chillSource = s.chillingSensitive ?? (b.season === 'warm' ? { source: SRC.chill, confidence: 'M' as const } : { source: SRC.noChill, confidence: 'M' as const });
  return {
    hardiness: at(p?.hardiness ?? b.hardiness, hardinessSource.confidence, hardinessSource.source),
    chillingSensitive: at(chilling, chillSource.confidence, chillSource.source),
    blossomDropWatchC: blossom((x) => x.highWatchF, true),
    blossomDropWarningC: blossom((x) => x.highWarningF, true),
    blossomDropNightAboveC: blossom((x) => x.nightAboveF, true),
    blossomDropNightBelowC: blossom((x) => x.nightBelowF, true),
    blossomDropDays: blossom((x) => x.minDays, false),
    pollinationHeatC: ph && phs ? at<number | null>(fToC(ph.highAboveF), phs.confidence, phs.source) : none(),
    pollinationWarningDay: ph && phs ? at<number | null>(ph.warningFromDay, phs.confidence, phs.source) : none(),
  };
}

function seedParams(b: Base) {
  const g = b.germF;
  const germSource = b.germSource ?? SRC.germ;
  const germConfidence: Confidence = b.germSource === SRC.germCole ? (b.key === 'broccoli' ? 'M' : 'L') : 'H';
  const germ = (i: 0 | 1 | 2) => (g ? at<number | null>(fToC(g[i]), germConfidence, germSource) : at<number | null>(null, 'L', SRC.germNone));
  return {
    germMinC: germ(0),
    germOptC: germ(1),
    germMaxC: germ(2),
    seedLifeYears:
      b.seedLife === null
        ? at<number | null>(null, 'L', SRC.seedLifeNone)
        : at<number | null>(b.seedLife, b.seedLifeSource ? 'M' : 'H', b.seedLifeSource ?? SRC.seedLife),
    sowDepthCm: at<number | null>(b.depthCm, 'from memory', SRC.practice),
    spacingCm: at<number | null>(b.spacingCm, 'from memory', SRC.practice),
  };
}

function build(b: Base): CropDefinition {
  const engineKey = b.engineKey ?? b.key;
  const params: CropParams = {
    season: at(b.season, 'M', b.season === 'cool' ? SRC.coolSeason : SRC.warmSeason),
    baseC: b.base,
    upperC: b.upper ?? (b.season === 'cool' ? at(null, 'L', SRC.noUpper) : at(30, 'L', SRC.upper86)),
    method: b.method ?? at('single-sine', 'M', SRC.method),
    cutoff: at('horizontal', b.method ? b.method.confidence : 'M', b.method ? b.method.source : SRC.method),
    ...boltParams(b, BOLT_TRIGGER_DEFAULTS[engineKey]),
    ...stressParams(b, STRESS_PROFILE_DEFAULTS[engineKey]),
    ...seedParams(b),
  };
  return { key: b.key, name: b.name, botanicalName: b.botanicalName, engineKey, bolts: b.season === 'cool' && b.bolts !== false, params };
}

export const CROP_LIBRARY: readonly CropDefinition[] = BASES.map(build);

const byKey = new Map(CROP_LIBRARY.map((crop) => [crop.key, crop]));

export const CROP_KEYS: readonly string[] = CROP_LIBRARY.map((crop) => crop.key);

export function findCrop(key: string): CropDefinition | undefined {
  return byKey.get(key);
}

