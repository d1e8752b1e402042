import { basisOfValues, sameBasis } from '#shared/crops/basis';
import { CROP_PARAMS, CROP_PARAM_KEYS } from '#shared/crops/params';
import type { CropParamKey } from '#shared/crops/params';
import type { CropDto, CropParamDto } from '#shared/schemas/crops';
import { effectiveValues, overrideValue } from './crops.service';
import type { CropWithOverrides } from './crops.service';
import { overrideBasis } from './crop-thermal';

type Scalar = CropParamDto['value'];

/** For a degree-day figure: the method it was counted with, and whether the crop still counts that way. */
function basisPart(c: CropWithOverrides, key: CropParamKey, value: Scalar): Pick<CropParamDto, 'ddBasis'> {
  const meta = CROP_PARAMS[key];
  if (meta.kind !== 'number' || meta.unit !== 'C-days' || value === null) return {};
  const effective = effectiveValues(c);
  if (effective.baseC === null) return {};
  const measured = overrideBasis(c.crop, c.overrides.get(key));
  return { ddBasis: { ...measured, stale: !sameBasis(measured, basisOfValues(effective)) } };
}

export function presentCrop(c: CropWithOverrides): CropDto {
  const { crop, overrides } = c;
  const params: CropParamDto[] = CROP_PARAM_KEYS.map((key) => {
    const meta = CROP_PARAMS[key];
    const def = crop.params[key];
    const o = overrides.get(key);
    const base = { key, label: meta.label, group: meta.group, kind: meta.kind, unit: meta.kind === 'number' ? meta.unit : null };
    if (!o) {
      const value = def.value as Scalar;
      return { ...base, value, source: def.source, confidence: def.confidence, origin: 'library', libraryDefault: null, updatedAt: null, ...basisPart(c, key, value) };
    }
    const value = overrideValue(o) as Scalar;
    return {
      ...base,
      ...basisPart(c, key, value),
      value,
      source: o.note ? `Set for this garden: ${o.note}` : 'Set for this garden',
      confidence: null,
      origin: 'garden',
      libraryDefault: { value: def.value, source: def.source, confidence: def.confidence },
      updatedAt: o.updatedAt.toISOString(),
    };
  });
  const season = params.find((p) => p.key === 'season')!.value as 'cool' | 'warm';
  return { key: crop.key, name: crop.name, botanicalName: crop.botanicalName, season, overrides: overrides.size, params };
}
