/**
 * The crop parameters Heatclock keeps, with their units and allowed ranges. Every value in the
 * library carries its source and a confidence grade (SCIENCE.md: H primary source, M secondary,
 * L weak, "from memory" recalled without a source read); a garden may override a value without
 * changing the shared default.
 */
import type { Confidence, Sourced } from '../thermal/index';

export type { Confidence, Sourced };

export const CONFIDENCES = ['H', 'M', 'L', 'from memory'] as const satisfies readonly Confidence[];

export const CONFIDENCE_WORDS: Record<Confidence, string> = {
  H: 'High confidence: primary source or verified formula',
  M: 'Medium confidence: secondary source',
  L: 'Low confidence: weak source',
  'from memory': 'Low confidence: a commonly given figure, not yet checked against a published table',
};

export const SEASONS = ['cool', 'warm'] as const;
export const HARDINESS_CLASSES = ['very-hardy', 'frost-tolerant', 'tender', 'warm-loving'] as const;
export const DD_METHODS = ['average', 'clamped-average', 'single-sine', 'single-triangle', 'double-sine', 'double-triangle'] as const;
export const DD_CUTOFFS = ['horizontal', 'vertical', 'intermediate'] as const;

export type CropSeason = (typeof SEASONS)[number];

export type ParamUnit = 'C' | 'C-days' | 'h' | 'days' | 'years' | 'cm';

export interface NumberParamMeta {
  kind: 'number';
  label: string;
  group: ParamGroup;
  /** Temperatures are stored in °C and converted for display; 'C-days' likewise. */
  unit: ParamUnit;
  min: number;
  max: number;
  integer?: boolean;
}

export interface EnumParamMeta {
  kind: 'enum';
  label: string;
  group: ParamGroup;
  options: readonly string[];
}

export interface BooleanParamMeta {
  kind: 'boolean';
  label: string;
  group: ParamGroup;
}

export type ParamMeta = NumberParamMeta | EnumParamMeta | BooleanParamMeta;

export const PARAM_GROUPS = ['Degree days', 'Bolting', 'Heat and cold', 'Seed and sowing'] as const;
export type ParamGroup = (typeof PARAM_GROUPS)[number];

const dd = 'Degree days' as const;
const bolt = 'Bolting' as const;
const stress = 'Heat and cold' as const;
const seed = 'Seed and sowing' as const;

/** Numbers may be null (not set / does not apply); enums and booleans always have a value. */
export const CROP_PARAMS = {
  season: { kind: 'enum', group: dd, label: 'Season', options: SEASONS },
  baseC: { kind: 'number', group: dd, label: 'Base temperature', unit: 'C', min: -5, max: 25 },
  upperC: { kind: 'number', group: dd, label: 'Upper threshold', unit: 'C', min: 15, max: 45 },
  method: { kind: 'enum', group: dd, label: 'Degree-day method', options: DD_METHODS },
  cutoff: { kind: 'enum', group: dd, label: 'Cutoff at the upper threshold', options: DD_CUTOFFS },
  boltHeatThresholdC: { kind: 'number', group: bolt, label: 'Heat: daily high above', unit: 'C', min: 10, max: 45 },
  boltHeatStreakDays: { kind: 'number', group: bolt, label: 'Heat: days in a row that make a streak', unit: 'days', min: 1, max: 30, integer: true },
  criticalPhotoperiodH: { kind: 'number', group: bolt, label: 'Critical day length', unit: 'h', min: 8, max: 20 },
  twilightAllowanceH: { kind: 'number', group: bolt, label: 'Twilight added to day length', unit: 'h', min: 0, max: 2 },
  vernalizationMinC: { kind: 'number', group: bolt, label: 'Vernalization: coldest counting daily mean', unit: 'C', min: -10, max: 20 },
  vernalizationMaxC: { kind: 'number', group: bolt, label: 'Vernalization: warmest counting daily mean', unit: 'C', min: -5, max: 20 },
  vernalizationDays: { kind: 'number', group: bolt, label: 'Vernalization: cold days needed', unit: 'days', min: 1, max: 120, integer: true },
  juvenileGdd: { kind: 'number', group: bolt, label: 'Vernalization: juvenile phase before cold counts', unit: 'C-days', min: 0, max: 3000 },
  hardiness: { kind: 'enum', group: stress, label: 'Hardiness class', options: HARDINESS_CLASSES },
  chillingSensitive: { kind: 'boolean', group: stress, label: 'Suffers chilling injury below ~10 °C (50 °F)' },
  blossomDropWatchC: { kind: 'number', group: stress, label: 'Blossom drop: watch when highs exceed', unit: 'C', min: 15, max: 50 },
  blossomDropWarningC: { kind: 'number', group: stress, label: 'Blossom drop: warning when highs exceed', unit: 'C', min: 15, max: 50 },
  blossomDropNightAboveC: { kind: 'number', group: stress, label: 'Blossom drop: nights above', unit: 'C', min: 5, max: 35 },
  blossomDropNightBelowC: { kind: 'number', group: stress, label: 'Blossom drop: nights below', unit: 'C', min: -5, max: 25 },
  blossomDropDays: { kind: 'number', group: stress, label: 'Blossom drop: days in a row', unit: 'days', min: 1, max: 30, integer: true },
  pollinationHeatC: { kind: 'number', group: stress, label: 'Pollination: highs above', unit: 'C', min: 20, max: 50 },
  pollinationWarningDay: { kind: 'number', group: stress, label: 'Pollination: warn from this day in a row', unit: 'days', min: 1, max: 30, integer: true },
  germMinC: { kind: 'number', group: seed, label: 'Germination soil temperature: minimum', unit: 'C', min: -5, max: 30 },
  germOptC: { kind: 'number', group: seed, label: 'Germination soil temperature: optimum', unit: 'C', min: 0, max: 40 },
  germMaxC: { kind: 'number', group: seed, label: 'Germination soil temperature: maximum', unit: 'C', min: 10, max: 50 },
  seedLifeYears: { kind: 'number', group: seed, label: 'Seed life under good storage', unit: 'years', min: 0, max: 20 },
  sowDepthCm: { kind: 'number', group: seed, label: 'Typical sowing depth', unit: 'cm', min: 0, max: 15 },
  spacingCm: { kind: 'number', group: seed, label: 'Typical spacing in the row', unit: 'cm', min: 1, max: 300 },
} as const satisfies Record<string, ParamMeta>;

export type CropParamKey = keyof typeof CROP_PARAMS;
export const CROP_PARAM_KEYS = Object.keys(CROP_PARAMS) as CropParamKey[];

export type ParamValue<K extends CropParamKey> = (typeof CROP_PARAMS)[K] extends { kind: 'enum'; options: readonly (infer O)[] }
  ? O
  : (typeof CROP_PARAMS)[K] extends { kind: 'boolean' }
    ? boolean
    : number | null;

export type CropParams = { [K in CropParamKey]: Sourced<ParamValue<K>> };

/** One value per parameter, as a garden uses them (shared defaults merged with its overrides). */
export type CropParamValues = { [K in CropParamKey]: ParamValue<K> };

export interface CropDefinition {
  key: string;
  name: string;
  botanicalName: string;
  /** Key of the crop in the thermal engine's bolt and stress defaults. */
  engineKey: string;
  /** False for crops that do not bolt within their garden season (warm-season crops, pea). */
  bolts: boolean;
  params: CropParams;
}
