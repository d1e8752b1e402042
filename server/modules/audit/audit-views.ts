/**
 * What the trail keeps of each audited record: its fields as a grower knows them (a planting's
 * bed and variety by name rather than by id), and the words that name it in a summary.
 */
import { varietyFields } from '../varieties/varieties.presenter';
import type { Bed, Garden, GerminationTest, Planting, SeedLot, Variety } from '../../db/models';

/** A planting read with its bed, variety and seed lot (plantingIncludes). */
export function plantingView(p: Planting): Record<string, unknown> {
  return {
    bed: p.bed?.name ?? null,
    variety: p.variety?.name ?? null,
    seedLot: p.seedLot ? lotLabel(p.seedLot) : null,
    method: p.method,
    status: p.status,
    quantity: p.quantity,
    quantityUnit: p.quantityUnit,
    sownOn: p.sownOn,
    emergedOn: p.emergedOn,
    thinnedOn: p.thinnedOn,
    transplantedOn: p.transplantedOn,
    firstHarvestOn: p.firstHarvestOn,
    lastHarvestOn: p.lastHarvestOn,
    boltedOn: p.boltedOn,
    notes: p.notes,
  };
}
export const PLANTING_FIELDS = Object.keys(plantingView({} as Planting));

/** "Copperleaf Butterhead in North 2". */
export function plantingSubject(p: Planting): string {
  return `${p.variety?.name ?? 'a planting'} in ${p.bed?.name ?? 'its bed'}`;
}

/** What the trail keeps of a variety: its stored packet facts, as the variety's presenter reads them. */
export function varietyView(v: Variety): Record<string, unknown> {
  return { ...varietyFields(v) };
}
export const VARIETY_FIELDS = Object.keys(varietyView({} as Variety));

/** "Ridgeline seed, lot 2291, packed for 2025" — whatever the lot has of these. */
export function lotLabel(l: Pick<SeedLot, 'supplier' | 'lotNumber' | 'packedForYear'>): string {
  const parts = [l.supplier || null, l.lotNumber ? `lot ${l.lotNumber}` : null, l.packedForYear ? `packed for ${l.packedForYear}` : null].filter(Boolean);
  return parts.length ? parts.join(', ') : 'unlabelled lot';
}

/** A seed lot read with its variety. */
export function seedLotView(l: SeedLot): Record<string, unknown> {
  return {
    variety: l.variety?.name ?? null,
    supplier: l.supplier,
    lotNumber: l.lotNumber,
    packedForYear: l.packedForYear,
    quantity: l.quantity,
    quantityUnit: l.quantityUnit,
    storageNotes: l.storageNotes,
  };
}
export const SEED_LOT_FIELDS = Object.keys(seedLotView({} as SeedLot));

/** "the seed lot of Copperleaf Butterhead (Ridgeline seed, lot 2291)". */
export function seedLotSubject(l: SeedLot): string {
  return `the seed lot of ${l.variety?.name ?? 'a variety'} (${lotLabel(l)})`;
}

export function germinationTestView(t: GerminationTest): Record<string, unknown> {
  return { testedOn: t.testedOn, seedsTested: t.seedsTested, germinated: t.germinated, notes: t.notes };
}

export function bedView(b: Bed): Record<string, unknown> {
  return { name: b.name, kind: b.kind, lengthM: b.lengthM, widthM: b.widthM, notes: b.notes };
}
export const BED_FIELDS = Object.keys(bedView({} as Bed));

export function gardenView(g: Garden): Record<string, unknown> {
  return { name: g.name, latitude: g.latitude, longitude: g.longitude, elevationM: g.elevationM, timeZone: g.timeZone, units: g.units };
}
export const GARDEN_FIELDS = Object.keys(gardenView({} as Garden));
