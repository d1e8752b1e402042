/**
 * The one place a crop's effective parameters (effectiveValues) become thermal-engine inputs:
 * the degree-day method, bolt triggers and stress profile. Pure: the caller loads the values.
 */
import { findCrop } from '#shared/crops/library';
import { basisOfValues, basisWords, libraryBasis, recordedBasis, sameBasis } from '#shared/crops/basis';
import type { DegreeDayBasis } from '#shared/crops/basis';
import type { CropDefinition, CropParamKey, CropParamValues } from '#shared/crops/params';
import { BOLT_TRIGGER_DEFAULTS, boltTriggersOf, cToF } from '#shared/thermal/index';
import { formatDegreeDays } from '#shared/thermal/units';
import type { BoltTriggers, DegreeDayMethod, StressProfile } from '#shared/thermal/index';
import type { CropOverride } from '../../db/models';

const PARAM_TRIGGERS = ['heatThresholdC', 'heatStreakDays', 'criticalPhotoperiodH', 'twilightAllowanceH', 'vernalization'] as const;

type OverrideBasis = Pick<CropOverride, 'ddBaseC' | 'ddUpperC' | 'ddMethod' | 'ddCutoff'>;

export interface CropBoltTriggers {
  triggers: BoltTriggers;
  /** Why a trigger is left out or weakened, in plain words; empty when all is as set. */
  notes: string[];
}

function definition(cropKey: string): CropDefinition {
  const crop = findCrop(cropKey);
  if (!crop) throw new RangeError(`cropKey (${cropKey}) is not in the crop library`);
  return crop;
}

/** Base, upper (when set), method and cutoff in °C; a RangeError when the base is not set. */
export function cropMethod(effective: CropParamValues): DegreeDayMethod {
  const b = basisOfValues(effective);
  return { base: b.baseC, method: b.method, cutoff: b.cutoff, ...(b.upperC !== null ? { upper: b.upperC } : {}) };
}

/** What a stored degree-day override was counted with; rows without one count as the library method. */
export function overrideBasis(crop: CropDefinition, row: OverrideBasis | undefined): DegreeDayBasis {
  const stored = row && recordedBasis({ baseC: row.ddBaseC, upperC: row.ddUpperC, method: row.ddMethod, cutoff: row.ddCutoff });
  return stored ?? libraryBasis(crop);
}

/**
 * The juvenile gate in degree days, or 0 with a note when its figure was counted with another
 * method than the crop now uses: a gate of 500 °C-days at base 0 °C is not 500 at base 4.4 °C.
 */
function juvenileGate(crop: CropDefinition, effective: CropParamValues, row: OverrideBasis | undefined, units: 'C' | 'F') {
  const gdd = effective.juvenileGdd;
  if (gdd === null || gdd === 0) return { gdd: 0, note: null };
  const measured = overrideBasis(crop, row);
  const current = basisOfValues(effective);
  if (sameBasis(measured, current)) return { gdd, note: null };
  const whose = row ? 'Your juvenile phase' : 'The library’s juvenile phase';
  const note =
    `${whose} of ${formatDegreeDays(gdd, units)} was counted at ${basisWords(measured, units)}; this crop now counts from ` +
    `${basisWords(current, units)}, so cold counts from the start until you set the juvenile phase again.`;
  return { gdd: 0, note };
}

/**
 * The bolt triggers this garden uses for the crop: the engine's defaults with the garden's
 * values of the bolting parameters over them. Null when the crop does not bolt (pea, warm-season
 * crops). A group missing a figure is left out with a note; `triggers` may then be empty.
 */
export function cropBoltTriggers(
  cropKey: string,
  effective: CropParamValues,
  overrides: ReadonlyMap<CropParamKey, OverrideBasis>,
  units: 'C' | 'F' = 'C',
): CropBoltTriggers | null {
  const crop = definition(cropKey);
  if (!crop.bolts) return null;
  const defaults = BOLT_TRIGGER_DEFAULTS[crop.engineKey];
  const triggers: BoltTriggers = defaults ? boltTriggersOf(defaults) : {};
  // The garden's parameters stand for these; the engine keeps any trigger without a parameter.
  for (const key of PARAM_TRIGGERS) delete triggers[key];
  const notes: string[] = [];
  const e = effective;
  if (e.boltHeatThresholdC !== null) {
    triggers.heatThresholdC = e.boltHeatThresholdC;
    if (e.boltHeatStreakDays !== null) triggers.heatStreakDays = e.boltHeatStreakDays;
  }
  if (e.criticalPhotoperiodH !== null) {
    triggers.criticalPhotoperiodH = e.criticalPhotoperiodH;
    if (e.twilightAllowanceH !== null) triggers.twilightAllowanceH = e.twilightAllowanceH;
  }
  const vernalization = [e.vernalizationMinC, e.vernalizationMaxC, e.vernalizationDays];
  if (vernalization.every((x) => x !== null)) {
    const gate = juvenileGate(crop, e, overrides.get('juvenileGdd'), units);
    if (gate.note) notes.push(gate.note);
    triggers.vernalization = { minC: e.vernalizationMinC!, maxC: e.vernalizationMaxC!, requiredDays: e.vernalizationDays!, juvenileGdd: gate.gdd };
  } else if (vernalization.some((x) => x !== null)) {
    notes.push('Vernalization is left out: it needs the coldest and warmest counting daily mean and the cold days needed, all three set.');
  }
  if (!Object.keys(triggers).length && !notes.length) notes.push(`No bolt trigger figures are set for ${crop.name.toLowerCase()}; set them in the crop library to assess bolting.`);
  return { triggers, notes };
}

/**
 * Hardiness, chilling, blossom drop and pollination heat in the engine's shapes; the engine's
 * profiles hold °F as published, so the stored °C figures go back through cToF. A blossom-drop
 * or pollination group missing a figure is left out of the profile.
 */
export function cropStressProfile(cropKey: string, effective: CropParamValues): StressProfile {
  definition(cropKey);
  const e = effective;
  const profile: StressProfile = { hardiness: e.hardiness, chillingSensitive: e.chillingSensitive };
  const { blossomDropWatchC: watch, blossomDropWarningC: warning, blossomDropNightAboveC: above, blossomDropNightBelowC: below, blossomDropDays: days } = e;
  if (watch !== null && warning !== null && above !== null && below !== null && days !== null) {
    profile.blossomDrop = { highWatchF: cToF(watch), highWarningF: cToF(warning), nightAboveF: cToF(above), nightBelowF: cToF(below), minDays: days };
  }
  if (e.pollinationHeatC !== null && e.pollinationWarningDay !== null) {
    profile.pollinationHeat = { highAboveF: cToF(e.pollinationHeatC), warningFromDay: e.pollinationWarningDay };
  }
  return profile;
}
