import type { Transaction } from 'sequelize';
import type { z } from 'zod';
import { CROP_LIBRARY, findCrop } from '#shared/crops/library';
import { basisOfValues } from '#shared/crops/basis';
import { paramProblems } from '#shared/crops/consistency';
import { CROP_PARAMS, CROP_PARAM_KEYS } from '#shared/crops/params';
import type { CropDefinition, CropParamKey, CropParamValues } from '#shared/crops/params';
import type { CropOverridesUpdateInput, cropListQuerySchema } from '#shared/schemas/crops';
import { CropOverride } from '../../db/models';
import { AppError } from '../../errors';
import { inTransaction } from '../../lib/transaction';
import { getGarden } from '../gardens/gardens.service';
import { recordAudit } from '../audit/audit';
import type { AuditActor, AuditChanges } from '../audit/audit';
import { changedSummary } from '../audit/audit-words';

type CropListQuery = z.output<typeof cropListQuerySchema>;

export interface CropWithOverrides {
  crop: CropDefinition;
  overrides: Map<CropParamKey, CropOverride>;
}

export function cropOrNotFound(cropKey: string): CropDefinition {
  const crop = findCrop(cropKey);
  if (!crop) throw AppError.notFound('That crop');
  return crop;
}

async function overridesOf(gardenId: number, cropKeys: string[], transaction?: Transaction, lock = false) {
  const rows = await CropOverride.findAll({ where: { gardenId, cropKey: cropKeys }, transaction, ...(lock && transaction ? { lock: transaction.LOCK.UPDATE } : {}) });
  const byCrop = new Map<string, Map<CropParamKey, CropOverride>>();
  for (const row of rows) {
    if (!(CROP_PARAM_KEYS as string[]).includes(row.paramKey)) continue;
    const m = byCrop.get(row.cropKey) ?? new Map<CropParamKey, CropOverride>();
    m.set(row.paramKey as CropParamKey, row);
    byCrop.set(row.cropKey, m);
  }
  return byCrop;
}

export function overrideValue(row: CropOverride): unknown {
  return JSON.parse(row.valueJson);
}

/** A crop's parameter values as this garden uses them: its overrides over the shared defaults. */
export function effectiveValues({ crop, overrides }: CropWithOverrides): CropParamValues {
  const out = {} as Record<CropParamKey, unknown>;
  for (const key of CROP_PARAM_KEYS) {
    const o = overrides.get(key);
    out[key] = o ? overrideValue(o) : crop.params[key].value;
  }
  return out as CropParamValues;
}

/** The values the garden would use after this change: a removed override falls back to the default. */
function valuesAfter(current: CropWithOverrides, input: CropOverridesUpdateInput): CropParamValues {
  const out: Record<CropParamKey, unknown> = effectiveValues(current);
  for (const key of CROP_PARAM_KEYS) {
    const change = input.params[key];
    if (change !== undefined) out[key] = change === null ? current.crop.params[key].value : change.value;
  }
  return out as CropParamValues;
}

function inconsistent(problems: Partial<Record<CropParamKey, string>>): AppError {
  const fields = Object.fromEntries(Object.entries(problems).map(([key, message]) => [`params.${key}.value`, message]));
  const message = [...new Set(Object.values(fields))].join(' ');
  return new AppError(400, 'validation_failed', message, fields);
}

const isDegreeDays = (key: CropParamKey) => {
  const meta = CROP_PARAMS[key];
  return meta.kind === 'number' && meta.unit === 'C-days';
};

export async function listCrops(gardenId: number, q: CropListQuery): Promise<CropWithOverrides[]> {
  const byCrop = await overridesOf(gardenId, CROP_LIBRARY.map((c) => c.key));
  const text = q.q?.toLowerCase();
  return CROP_LIBRARY.map((crop) => ({ crop, overrides: byCrop.get(crop.key) ?? new Map<CropParamKey, CropOverride>() })).filter((c) => {
    const season = (c.overrides.has('season') ? overrideValue(c.overrides.get('season')!) : c.crop.params.season.value) as string;
    if (q.season && season !== q.season) return false;
    return !text || c.crop.name.toLowerCase().includes(text) || c.crop.botanicalName.toLowerCase().includes(text);
  });
}

export async function getCrop(gardenId: number, cropKey: string, transaction?: Transaction): Promise<CropWithOverrides> {
  const crop = cropOrNotFound(cropKey);
  const byCrop = await overridesOf(gardenId, [crop.key], transaction);
  return { crop, overrides: byCrop.get(crop.key) ?? new Map<CropParamKey, CropOverride>() };
}

/**
 * Sets or clears this garden's own values; the shared library is never written. The change is
 * checked together with everything it leaves in place, and a degree-day figure keeps the
 * method it is counted with after this change (the grower's figure is read in that method).
 */
export async function updateCropOverrides(gardenId: number, actor: AuditActor, cropKey: string, input: CropOverridesUpdateInput) {
  const crop = cropOrNotFound(cropKey);
  const garden = await getGarden(gardenId);
  return inTransaction(CropOverride.sequelize!, async (transaction) => {
    const byCrop = await overridesOf(gardenId, [crop.key], transaction, true);
    const after = valuesAfter({ crop, overrides: byCrop.get(crop.key) ?? new Map<CropParamKey, CropOverride>() }, input);
    const problems = paramProblems(after, garden.units);
    if (Object.keys(problems).length) throw inconsistent(problems);
    const basis = basisOfValues(after);
    const changes: AuditChanges = {};
    for (const key of CROP_PARAM_KEYS) {
      const change = input.params[key];
      if (change === undefined) continue;
      const where = { gardenId, cropKey: crop.key, paramKey: key };
      const existing = await CropOverride.findOne({ where, transaction, lock: transaction.LOCK.UPDATE });
      // null on either side: the library's value.
      const was = existing ? (JSON.parse(existing.valueJson) as unknown) : null;
      if (JSON.stringify(was) !== JSON.stringify(change?.value ?? null)) changes[key] = { from: was, to: change?.value ?? null };
      if (change === null) {
        await existing?.destroy({ transaction });
        continue;
      }
      const measured = isDegreeDays(key) && change.value !== null;
      const fields = {
        valueJson: JSON.stringify(change.value),
        note: change.note ?? '',
        updatedBy: actor.id,
        ddBaseC: measured ? basis.baseC : null,
        ddUpperC: measured ? basis.upperC : null,
        ddMethod: measured ? basis.method : null,
        ddCutoff: measured ? basis.cutoff : null,
      };
      if (existing) await existing.update(fields, { transaction });
      else await CropOverride.create({ ...where, ...fields }, { transaction });
    }
    if (Object.keys(changes).length) {
      await recordAudit(transaction, { gardenId, actor, entity: 'crop-settings', entityId: crop.key, action: 'changed', summary: changedSummary(changes, `${crop.name} in this garden`, 'crop-settings'), changes });
    }
    return getCrop(gardenId, crop.key, transaction);
  });
}

/** Every crop's values as this garden has them, by crop key. */
export async function effectiveCrops(gardenId: number): Promise<Map<string, ReturnType<typeof effectiveValues>>> {
  const crops = await listCrops(gardenId, {});
  return new Map(crops.map((c) => [c.crop.key, effectiveValues(c)]));
}
