import type { UserDto } from '#shared/schemas/auth';
import type { GardenDto } from '#shared/schemas/gardens';
import type { BedDto } from '#shared/schemas/beds';
import type { CropDto, CropParamDto } from '#shared/schemas/crops';
import type { PlantingDto } from '#shared/schemas/plantings';

// Invented test people and places, in the spirit of the demo scenario.
export const grower: UserDto = { id: 7, email: 'mara@example.org', name: 'Mara Quill' };

export function aGarden(overrides: Partial<GardenDto> = {}): GardenDto {
  return {
    id: 1,
    name: 'Hollowbrook Teaching Garden',
    latitude: 44.52,
    longitude: -72.81,
    elevationM: 210,
    timeZone: 'America/New_York',
    units: 'F',
    hemisphere: 'N',
    role: 'owner',
    ...overrides,
  };
}

export function aPlanting(overrides: Partial<PlantingDto> = {}): PlantingDto {
  return {
    id: 5,
    bed: { id: 3, name: 'North 1' },
    variety: { id: 7, name: 'Copperleaf Butterhead', dtmDays: 55, dtmFrom: 'sowing', boltTolerance: 3 },
    crop: { key: 'lettuce', name: 'Lettuce', season: 'cool' },
    seedLot: { id: 11, label: 'Lot HC-01001' },
    method: 'direct-sow',
    status: 'growing',
    quantity: 24,
    quantityUnit: 'plants',
    sownOn: '2025-04-02',
    emergedOn: '2025-04-10',
    thinnedOn: null,
    transplantedOn: null,
    firstHarvestOn: null,
    lastHarvestOn: null,
    boltedOn: null,
    notes: 'Under the row cover.',
    season: '2025',
    nextEvent: { label: 'First harvest', on: '2025-05-27', basis: '55 days from sowing' },
    logCount: 14,
    ...overrides,
  };
}

export function aBed(overrides: Partial<BedDto> = {}): BedDto {
  return { id: 3, name: 'North 1', kind: 'raised-bed', lengthM: 2.4, widthM: 1.2, areaM2: 2.88, notes: '', activePlantings: 2, plantingsOnRecord: 5, ...overrides };
}

/** A crop with a few of its parameters, enough for the library page. */
export function aCrop(params: CropParamDto[], overrides: Partial<CropDto> = {}): CropDto {
  return {
    key: 'lettuce',
    name: 'Lettuce',
    botanicalName: 'Lactuca sativa',
    season: 'cool',
    overrides: params.filter((p) => p.origin === 'garden').length,
    params,
    ...overrides,
  };
}

export function aParam(overrides: Partial<CropParamDto> = {}): CropParamDto {
  return {
    key: 'baseC',
    label: 'Base temperature',
    group: 'Degree days',
    kind: 'number',
    unit: 'C',
    value: 4.4,
    source: 'Extension bulletin (invented for tests)',
    confidence: 'M',
    origin: 'library',
    libraryDefault: null,
    updatedAt: null,
    ...overrides,
  };
}
