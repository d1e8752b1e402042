/**
 * Default, editable crop data for bolt triggers and stress profiles. Every figure carries its
 * source and the confidence SCIENCE.md grades it with: 'H' primary source, 'M' secondary,
 * 'L' weak, 'from memory' recalled without a source read. Figures we chose ourselves say
 * "common practice, no source". These seed the crop library; growers may change any of them.
 */
import type { BoltTriggers } from './bolt-risk';
import type { StressProfile } from './stress';
import { fToC } from './units';

export type Confidence = 'from memory' | 'L' | 'M' | 'H';

export interface Sourced<T> {
  value: T;
  source: string;
  confidence: Confidence;
}

type SourcedFields<T> = { [K in keyof T]?: Sourced<T[K]> };

export interface CropBoltDefaults {
  triggers: SourcedFields<BoltTriggers>;
  note?: string;
}

const OUR_STREAK: Sourced<number> = { value: 3, source: 'common practice, no source', confidence: 'L' };
const TWILIGHT: Sourced<number> = { value: 0.5, source: 'SCIENCE §3: effective photoperiod ≈0.5–1 h longer than sunrise–sunset (from memory)', confidence: 'from memory' };

export const BOLT_TRIGGER_DEFAULTS: Record<string, CropBoltDefaults> = {
  spinach: {
    triggers: {
      criticalPhotoperiodH: { value: 14, source: 'Chun et al. 2001, HortScience 36(5):889: ≈13–14 h, cultivar-dependent', confidence: 'M' },
      twilightAllowanceH: TWILIGHT,
      heatThresholdC: { value: 24, source: 'extension default, ~75 °F (from memory)', confidence: 'from memory' },
      heatStreakDays: OUR_STREAK,
    },
    note: 'Quantitative long-day plant without a juvenile stage (Chun et al. 2001).',
  },
  lettuce: {
    triggers: {
      heatThresholdC: { value: 27, source: 'SCIENCE §3: sustained highs above ~75–80 °F (24–27 °C) (from memory)', confidence: 'from memory' },
      heatStreakDays: OUR_STREAK,
      criticalPhotoperiodH: { value: 14, source: 'long days promote bolting (MSU Ext.); the 14 h figure is from memory', confidence: 'from memory' },
      twilightAllowanceH: TWILIGHT,
    },
    note: 'Long days and heat both promote bolting; lettuce can bolt from heat alone.',
  },
  cilantro: {
    triggers: {
      criticalPhotoperiodH: { value: 12, source: 'SCIENCE §3: ~12 h, weakly sourced', confidence: 'L' },
      heatThresholdC: { value: fToC(75), source: 'SCIENCE §3: >75 °F, weakly sourced (Meyering et al. 2020 for heat and long days)', confidence: 'L' },
      heatStreakDays: OUR_STREAK,
    },
  },
  arugula: {
    triggers: {
      criticalPhotoperiodH: { value: 14, source: 'long-day plant (SCIENCE §3, L); 14 h from memory', confidence: 'from memory' },
      heatThresholdC: { value: 24, source: 'bolts in spring heat (SCIENCE §3, L); ~75 °F from memory', confidence: 'from memory' },
      heatStreakDays: OUR_STREAK,
    },
  },
  radish: {
    triggers: {
      criticalPhotoperiodH: { value: 14, source: 'European types are long-day (SCIENCE §3, M); 14 h from memory', confidence: 'from memory' },
      heatThresholdC: { value: 27, source: 'from memory', confidence: 'from memory' },
      heatStreakDays: OUR_STREAK,
    },
    note: 'Oriental types also respond to vernalization (SCIENCE §3, M); add the trigger per variety.',
  },
  'bok choy': {
    triggers: {
      vernalization: {
        value: { minC: 0, maxC: fToC(50), requiredDays: 14, juvenileGdd: 0 },
        source: 'SCIENCE §3: 1–3 weeks below 50–55 °F (L); 0 °C floor and no juvenile gate from memory',
        confidence: 'L',
      },
      criticalPhotoperiodH: { value: 14, source: 'long days promote bolting (SCIENCE §3); 14 h from memory', confidence: 'from memory' },
    },
  },
  cabbage: {
    triggers: {
      vernalization: {
        value: { minC: 4, maxC: 10, requiredDays: 42, juvenileGdd: 500 },
        source: 'SCIENCE §3: biennial vernalized at ≈4–10 °C after a juvenile phase (M); 6 weeks and 500 °C-days (base 0) from memory',
        confidence: 'from memory',
      },
    },
  },
  celery: {
    triggers: {
      vernalization: {
        value: { minC: 0, maxC: fToC(55), requiredDays: 10, juvenileGdd: 300 },
        source: 'SCIENCE §3: 10+ days below ~55 °F can induce (from memory); juvenile 300 °C-days from memory',
        confidence: 'from memory',
      },
    },
  },
  pea: {
    triggers: {
      heatThresholdC: { value: fToC(90), source: 'SCIENCE §4: beans/peas drop flowers ≈90–95 °F (L–M)', confidence: 'L' },
      heatStreakDays: OUR_STREAK,
    },
    note: 'Peas do not bolt; the heat trigger stands for the end of flowering and harvest.',
  },
};

/** The plain trigger values of a crop's defaults, ready for assessBoltRisk. */
export function boltTriggersOf(defaults: CropBoltDefaults): BoltTriggers {
  const out: Record<string, unknown> = {};
  for (const [k, v] of Object.entries(defaults.triggers)) if (v) out[k] = v.value;
  return out;
}

const BLOSSOM_DROP = {
  value: { highWatchF: 85, highWarningF: 92, nightAboveF: 70, nightBelowF: 55, minDays: 3 },
  source: 'SCIENCE §4: Utah State and Oklahoma State Ext., quoted secondhand (M); 3 days for "several" is common practice, no source',
  confidence: 'M' as const,
};

export interface CropStressDefaults {
  profile: StressProfile;
  sources: { [K in keyof StressProfile]?: { source: string; confidence: Confidence } };
}

const CLASS_SOURCE = { source: 'Purdue HO-203 from Illinois VC-14 (SCIENCE §4)', confidence: 'M' as const };
const CHILL_SOURCE = { source: 'SCIENCE §4: chilling injury of warm-season crops below ~50 °F', confidence: 'M' as const };

export const STRESS_PROFILE_DEFAULTS: Record<string, CropStressDefaults> = {
  lettuce: { profile: { hardiness: 'very-hardy' }, sources: { hardiness: CLASS_SOURCE } },
  pea: { profile: { hardiness: 'very-hardy' }, sources: { hardiness: CLASS_SOURCE } },
  spinach: { profile: { hardiness: 'very-hardy' }, sources: { hardiness: CLASS_SOURCE } },
  radish: { profile: { hardiness: 'frost-tolerant' }, sources: { hardiness: CLASS_SOURCE } },
  'bok choy': { profile: { hardiness: 'frost-tolerant' }, sources: { hardiness: CLASS_SOURCE } },
  tomato: {
    profile: { hardiness: 'tender', chillingSensitive: true, blossomDrop: BLOSSOM_DROP.value },
    sources: { hardiness: CLASS_SOURCE, chillingSensitive: CHILL_SOURCE, blossomDrop: BLOSSOM_DROP },
  },
  bean: {
    profile: { hardiness: 'tender', chillingSensitive: true, blossomDrop: { ...BLOSSOM_DROP.value, highWatchF: 90, highWarningF: 95 } },
    sources: { hardiness: CLASS_SOURCE, chillingSensitive: CHILL_SOURCE, blossomDrop: { source: 'SCIENCE §4: beans drop flowers ≈90–95 °F (L–M); night limits as tomato', confidence: 'L' } },
  },
  'sweet corn': {
    profile: { hardiness: 'tender', chillingSensitive: true, pollinationHeat: { highAboveF: 95, warningFromDay: 4 } },
    sources: { hardiness: CLASS_SOURCE, chillingSensitive: CHILL_SOURCE, pollinationHeat: { source: 'Rees & Hoegemeyer 2019, UNL CropWatch', confidence: 'H' } },
  },
  pepper: {
    profile: { hardiness: 'warm-loving', chillingSensitive: true, blossomDrop: BLOSSOM_DROP.value },
    sources: { hardiness: CLASS_SOURCE, chillingSensitive: CHILL_SOURCE, blossomDrop: BLOSSOM_DROP },
  },
  cucumber: { profile: { hardiness: 'warm-loving', chillingSensitive: true }, sources: { hardiness: CLASS_SOURCE, chillingSensitive: CHILL_SOURCE } },
};
