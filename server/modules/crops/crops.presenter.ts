import { CROP_PARAMS, CROP_PARAM_KEYS } from '#shared/crops/params';
import type { CropDto, CropParamDto } from '#shared/schemas/crops';
import { overrideValue } from './crops.service';
import type { CropWithOverrides } from './crops.service';

type Scalar = CropParamDto['value'];

export function presentCrop({ crop, overrides }: CropWithOverrides): CropDto {
  const params: CropParamDto[] = CROP_PARAM_KEYS.map((key) => {
    const meta = CROP_PARAMS[key];
    const def = crop.params[key];
    const o = overrides.get(key);
    const base = { key, label: meta.label, group: meta.group, kind: meta.kind, unit: meta.kind === 'number' ? meta.unit : null };
    if (!o) {
      return { ...base, value: def.value as Scalar, source: def.source, confidence: def.confidence, origin: 'library', libraryDefault: null, updatedAt: null };
    }
    return {
      ...base,
      value: overrideValue(o) as Scalar,
      source: o.note ? `Set for this garden: ${o.note}` : 'Set for this garden',
      confidence: null,
      origin: 'garden',
      libraryDefault: { value: def.value as Scalar, source: def.source, confidence: def.confidence },
      updatedAt: o.updatedAt.toISOString(),
    };
  });
  const season = params.find((p) => p.key === 'season')!.value as 'cool' | 'warm';
  return { key: crop.key, name: crop.name, botanicalName: crop.botanicalName, season, overrides: overrides.size, params };
}
