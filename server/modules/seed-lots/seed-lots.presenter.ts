import { findCrop } from '#shared/crops/library';
import { estimateViability } from '#shared/crops/viability';
import type { GerminationTestDto, SeedLotDto } from '#shared/schemas/seed-lots';
import { germinationPercent } from '#shared/thermal/index';
import type { GerminationTest, SeedLot } from '../../db/models';
import { latestTest } from './seed-lots.service';

export function presentTest(t: GerminationTest): GerminationTestDto {
  return {
    id: t.id,
    testedOn: t.testedOn,
    seedsTested: t.seedsTested,
    germinated: t.germinated,
    percent: germinationPercent(t.germinated, t.seedsTested),
    notes: t.notes,
  };
}

/** seedLife: the crop's seed life in years as this garden has it (its override or the library's). */
export function presentSeedLot(lot: SeedLot, tests: readonly GerminationTest[], seedLife: number | null, today: string, withTests = false): SeedLotDto {
  const variety = lot.variety!;
  const latest = latestTest(tests);
  const latestDto = latest ? presentTest(latest) : null;
  return {
    id: lot.id,
    variety: { id: variety.id, name: variety.name, cropKey: variety.cropKey, cropName: findCrop(variety.cropKey)?.name ?? variety.cropKey, traits: variety.traits },
    supplier: lot.supplier,
    lotNumber: lot.lotNumber,
    packedForYear: lot.packedForYear,
    quantity: lot.quantity,
    quantityUnit: lot.quantityUnit,
    storageNotes: lot.storageNotes,
    latestTest: latestDto,
    viability: estimateViability({
      packedForYear: lot.packedForYear,
      currentYear: Number(today.slice(0, 4)),
      seedLifeYears: seedLife,
      latestTest: latestDto,
    }),
    ...(withTests ? { tests: tests.map(presentTest) } : {}),
  };
}
