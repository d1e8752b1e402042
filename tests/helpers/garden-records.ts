import { randomUUID } from 'node:crypto';
import type { InferCreationAttributes } from 'sequelize';
import { Bed, Planting, SeedLot, Variety } from '../../server/db/models';
import { agent } from './test-app';
import type { TestAgent, testApp } from './test-app';
import { gardenWithMembers, signIn } from './factories';

/** A garden with a signed-in client for each role and for an outsider. */
export async function gardenWithClients(app: ReturnType<typeof testApp>) {
  const ctx = await gardenWithMembers();
  const clients = {} as Record<'owner' | 'grower' | 'viewer' | 'outsider', TestAgent>;
  for (const role of ['owner', 'grower', 'viewer', 'outsider'] as const) {
    // A default header, as the web client sends it: DELETEs carry no body, so the CSRF guard needs it.
    clients[role] = agent(app).set('X-Requested-With', 'heatclock-test');
    await signIn(clients[role], ctx[role].email);
  }
  return { ...ctx, clients, base: `/api/gardens/${ctx.garden.id}` };
}

export async function makeBed(gardenId: number, name = `Bed ${randomUUID().slice(0, 6)}`) {
  return Bed.create({ gardenId, name, kind: 'bed', lengthM: 3, widthM: 1.2, notes: '' });
}

export async function makeVariety(gardenId: number, attrs: Partial<InferCreationAttributes<Variety>> = {}) {
  return Variety.create({
    gardenId,
    cropKey: 'lettuce',
    name: `Test lettuce ${randomUUID().slice(0, 6)}`,
    dtmDays: 50,
    dtmFrom: 'sowing',
    emergenceDaysMin: 4,
    emergenceDaysMax: 8,
    boltTolerance: 3,
    heatTolerance: 3,
    traits: ['open-pollinated'],
    containerFriendly: false,
    sunHours: 6,
    waterCmPerWeek: 2.5,
    sowDepthCm: 0.5,
    spacingCm: 25,
    thinSpacingCm: null,
    gddTargetOverrideC: null,
    notes: '',
    ...attrs,
  });
}

export async function makeLot(gardenId: number, varietyId: number, attrs: Partial<InferCreationAttributes<SeedLot>> = {}) {
  return SeedLot.create({ gardenId, varietyId, supplier: 'Test supplier', lotNumber: `L-${randomUUID().slice(0, 6)}`, packedForYear: 2024, quantity: 100, quantityUnit: 'seeds', storageNotes: '', ...attrs });
}

export async function makePlanting(gardenId: number, attrs: Partial<InferCreationAttributes<Planting>> = {}) {
  const bed = attrs.bedId ? null : await makeBed(gardenId);
  const variety = attrs.varietyId ? null : await makeVariety(gardenId);
  return Planting.create({
    gardenId,
    bedId: bed?.id ?? attrs.bedId!,
    varietyId: variety?.id ?? attrs.varietyId!,
    seedLotId: null,
    method: 'direct-sow',
    status: 'growing',
    quantity: 20,
    quantityUnit: 'plants',
    sownOn: '2025-04-01',
    emergedOn: null,
    thinnedOn: null,
    transplantedOn: null,
    firstHarvestOn: null,
    lastHarvestOn: null,
    boltedOn: null,
    notes: '',
    createdBy: null,
    ...attrs,
  });
}
