/**
 * The demo gardens' records: beds, varieties, seed lots with germination tests, and three past
 * seasons plus the current one of plantings with logs, all invented. Dates are placed relative
 * to the day of seeding and to each garden's hemisphere (a southern season runs July–June), so
 * the demo tells a true-looking story whenever it is started.
 *
 * Idempotent: every row is found or created by its natural key; plantings are only laid out for
 * a garden that has none yet, so seeding on a later day never stacks a second, shifted history.
 */
import type { Transaction } from 'sequelize';
import { addDays, dayLengthHours, seasonOf } from '#shared/thermal/index';
import type { PlantingMethod, PlantingStatus } from '#shared/schemas/plantings';
import type { VarietyCreateInput } from '#shared/schemas/varieties';
import { Bed, GerminationTest, Planting, PlantingLog, SeedLot, Variety } from '../models';
import type { Garden, User } from '../models';

type VarietySeed = Omit<VarietyCreateInput, 'notes' | 'gddTargetOverrideC' | 'sunHours' | 'waterCmPerWeek' | 'thinSpacingCm'> &
  Partial<Pick<VarietyCreateInput, 'notes' | 'sunHours' | 'waterCmPerWeek' | 'thinSpacingCm'>>;

const v = (cropKey: string, name: string, dtmDays: number, dtmFrom: VarietySeed['dtmFrom'], e: [number, number], bolt: number | null, heat: number | null, traits: VarietySeed['traits'], depth: number, spacing: number, extra: Partial<VarietySeed> = {}): VarietySeed => ({
  cropKey,
  name,
  dtmDays,
  dtmFrom,
  emergenceDaysMin: e[0],
  emergenceDaysMax: e[1],
  boltTolerance: bolt,
  heatTolerance: heat,
  traits,
  containerFriendly: false,
  sowDepthCm: depth,
  spacingCm: spacing,
  ...extra,
});

/** Invented variety names; the packet facts are plausible, not copied from any catalogue. */
export const DEMO_VARIETIES: VarietySeed[] = [
  v('lettuce', 'Copperleaf Butterhead', 50, 'emergence', [4, 8], 3, 3, ['open-pollinated', 'heirloom'], 0.5, 25, { containerFriendly: true, thinSpacingCm: 25, sunHours: 5, waterCmPerWeek: 2.5 }),
  v('lettuce', 'Marbleridge Romaine', 62, 'emergence', [4, 9], 2, 2, ['f1-hybrid', 'pelleted'], 0.5, 30, { thinSpacingCm: 30 }),
  v('spinach', 'Longwinter Savoy', 42, 'sowing', [6, 12], 2, 2, ['open-pollinated'], 1.5, 8, { thinSpacingCm: 10 }),
  v('spinach', 'Tealshield', 40, 'sowing', [6, 12], 3, 3, ['f1-hybrid', 'treated'], 1.5, 8, { notes: 'Fungicide-treated seed, pink coating.' }),
  v('arugula', 'Peppertooth', 35, 'sowing', [4, 8], 2, 2, ['open-pollinated', 'organic'], 0.5, 10, { containerFriendly: true }),
  v('cilantro', 'Slowhand', 50, 'sowing', [7, 14], 4, 2, ['open-pollinated'], 1, 15),
  v('cilantro', 'Brightstem', 45, 'sowing', [7, 14], 1, 1, ['open-pollinated'], 1, 15, { notes: 'Quick to leaf, quick to bolt.' }),
  v('lettuce', 'Summerhold Batavian', 55, 'emergence', [4, 8], 5, 5, ['open-pollinated'], 0.5, 30, { thinSpacingCm: 30 }),
  v('radish', 'Emberglobe', 26, 'sowing', [3, 7], 3, 3, ['open-pollinated'], 1.2, 4, { containerFriendly: true }),
  v('radish', 'Snowtip Breakfast', 24, 'sowing', [3, 7], 2, 2, ['heirloom', 'open-pollinated'], 1.2, 4),
  v('pea', 'Brookside Shelling', 64, 'sowing', [7, 14], null, 2, ['open-pollinated'], 2.5, 5),
  v('pea', 'Lanternpod Snap', 60, 'sowing', [7, 14], null, 3, ['open-pollinated', 'organic'], 2.5, 5, { containerFriendly: true }),
  v('bok-choy', 'Riverglass Baby', 45, 'sowing', [4, 7], 3, 3, ['f1-hybrid'], 1, 15),
  v('tomato', 'Hollowlight Cherry', 65, 'transplant', [6, 12], null, 4, ['f1-hybrid'], 0.6, 60, { containerFriendly: true, sunHours: 8, waterCmPerWeek: 3 }),
  v('tomato', 'Aunt Odile’s Pink', 80, 'transplant', [6, 12], null, 2, ['heirloom', 'open-pollinated'], 0.6, 60, { sunHours: 8 }),
  v('pepper', 'Marigold Blocky', 72, 'transplant', [8, 14], null, 3, ['f1-hybrid'], 0.6, 45, { sunHours: 8 }),
  v('snap-bean', 'Tallgrass Bush', 55, 'sowing', [6, 10], null, 3, ['open-pollinated'], 2.5, 8),
  v('snap-bean', 'Sundial Pole', 65, 'sowing', [6, 10], null, 4, ['open-pollinated', 'organic'], 2.5, 15),
];

interface Template {
  variety: string;
  bed: number;
  method: PlantingMethod;
  /** Days after the season's first day (Jan 1 north, Jul 1 south) of the start event. */
  day: number;
  emerge?: number;
  thin?: number;
  transplant?: number;
  harvest?: [number, number];
  /** Days after start; set for the seasons in which it bolted (by season index, 0 = oldest). */
  bolt?: { after: number; seasons: number[] };
  quantity: [number, 'plants' | 'seeds' | 'row-m'];
}

/** A season's plantings, shifted a few days per season so the years differ as real ones do. */
const TEMPLATES: Template[] = [
  { variety: 'Brookside Shelling', bed: 1, method: 'direct-sow', day: 75, emerge: 11, harvest: [68, 82], quantity: [6, 'row-m'] },
  // Lettuce and spinach are sown side by side in spring, late spring and late summer, so their
  // varieties meet the same weather; with weather at hand their harvests and bolting follow it
  // (settleDemoOutcomes), and these fixed days are used only without it.
  { variety: 'Longwinter Savoy', bed: 2, method: 'direct-sow', day: 80, emerge: 9, thin: 24, harvest: [44, 52], bolt: { after: 50, seasons: [1, 3] }, quantity: [3, 'row-m'] },
  { variety: 'Tealshield', bed: 2, method: 'direct-sow', day: 82, emerge: 9, thin: 24, harvest: [42, 58], quantity: [3, 'row-m'] },
  { variety: 'Longwinter Savoy', bed: 1, method: 'direct-sow', day: 108, emerge: 8, harvest: [40, 48], bolt: { after: 36, seasons: [0, 1, 2, 3] }, quantity: [3, 'row-m'] },
  { variety: 'Tealshield', bed: 7, method: 'direct-sow', day: 110, emerge: 8, harvest: [40, 50], bolt: { after: 47, seasons: [1] }, quantity: [3, 'row-m'] },
  { variety: 'Copperleaf Butterhead', bed: 3, method: 'direct-sow', day: 85, emerge: 6, thin: 21, harvest: [56, 70], bolt: { after: 66, seasons: [2] }, quantity: [24, 'plants'] },
  { variety: 'Marbleridge Romaine', bed: 3, method: 'transplant', day: 95, harvest: [58, 66], bolt: { after: 60, seasons: [1, 2, 3] }, quantity: [18, 'plants'] },
  { variety: 'Summerhold Batavian', bed: 4, method: 'direct-sow', day: 88, emerge: 6, thin: 21, harvest: [58, 72], quantity: [18, 'plants'] },
  { variety: 'Copperleaf Butterhead', bed: 5, method: 'direct-sow', day: 118, emerge: 5, harvest: [50, 60], bolt: { after: 52, seasons: [0, 2] }, quantity: [18, 'plants'] },
  { variety: 'Marbleridge Romaine', bed: 4, method: 'transplant', day: 122, harvest: [52, 58], bolt: { after: 40, seasons: [0, 1, 2, 3] }, quantity: [12, 'plants'] },
  { variety: 'Summerhold Batavian', bed: 2, method: 'direct-sow', day: 120, emerge: 5, harvest: [52, 66], quantity: [18, 'plants'] },
  { variety: 'Peppertooth', bed: 4, method: 'direct-sow', day: 88, emerge: 5, harvest: [30, 40], bolt: { after: 38, seasons: [0, 1, 2, 3] }, quantity: [2, 'row-m'] },
  { variety: 'Slowhand', bed: 5, method: 'direct-sow', day: 90, emerge: 10, harvest: [45, 50], bolt: { after: 52, seasons: [0, 2, 3] }, quantity: [2, 'row-m'] },
  { variety: 'Emberglobe', bed: 6, method: 'direct-sow', day: 85, emerge: 5, harvest: [27, 33], quantity: [3, 'row-m'] },
  { variety: 'Riverglass Baby', bed: 7, method: 'direct-sow', day: 92, emerge: 5, thin: 18, harvest: [44, 48], bolt: { after: 40, seasons: [0] }, quantity: [20, 'plants'] },
  { variety: 'Hollowlight Cherry', bed: 8, method: 'indoor-start', day: 75, emerge: 8, transplant: 60, harvest: [128, 200], quantity: [6, 'plants'] },
  { variety: 'Aunt Odile’s Pink', bed: 9, method: 'indoor-start', day: 70, emerge: 9, transplant: 65, harvest: [148, 200], quantity: [4, 'plants'] },
  { variety: 'Marigold Blocky', bed: 10, method: 'indoor-start', day: 65, emerge: 12, transplant: 75, harvest: [150, 205], quantity: [6, 'plants'] },
  { variety: 'Tallgrass Bush', bed: 4, method: 'direct-sow', day: 140, emerge: 8, harvest: [56, 75], quantity: [4, 'row-m'] },
  { variety: 'Sundial Pole', bed: 11, method: 'direct-sow', day: 145, emerge: 8, harvest: [66, 100], quantity: [12, 'plants'] },
  { variety: 'Snowtip Breakfast', bed: 12, method: 'direct-sow', day: 235, emerge: 5, harvest: [25, 30], quantity: [20, 'plants'] },
  { variety: 'Copperleaf Butterhead', bed: 6, method: 'direct-sow', day: 225, emerge: 6, thin: 21, harvest: [52, 64], bolt: { after: 50, seasons: [1, 3] }, quantity: [18, 'plants'] },
  { variety: 'Marbleridge Romaine', bed: 7, method: 'transplant', day: 215, harvest: [50, 58], bolt: { after: 38, seasons: [0, 1, 2, 3] }, quantity: [12, 'plants'] },
  { variety: 'Summerhold Batavian', bed: 12, method: 'direct-sow', day: 228, emerge: 6, harvest: [54, 66], quantity: [18, 'plants'] },
  { variety: 'Longwinter Savoy', bed: 1, method: 'direct-sow', day: 240, emerge: 10, harvest: [48, 70], bolt: { after: 40, seasons: [0, 2] }, quantity: [3, 'row-m'] },
  { variety: 'Tealshield', bed: 5, method: 'direct-sow', day: 242, emerge: 10, harvest: [46, 64], quantity: [3, 'row-m'] },
];

/**
 * Invented for the demo: what each lettuce and spinach variety really needs, unknown to the
 * product. `dd` is the degree days (°C-days, the crop's method) from the start event to the
 * first picking; `heatDays` how many heat days (highs above the crop's bolt heat threshold) it
 * stands, once past its first 40 % of growth, before it runs to seed. With the garden's weather at
 * hand the plantings above follow these (demo-outcomes.ts), so Compare ranks them from what the
 * weather did, and Calibration finds targets that differ from the packet's.
 */
export const DEMO_VARIETY_TRUTH: Readonly<Record<string, { dd: number; heatDays: number }>> = {
  'Summerhold Batavian': { dd: 600, heatDays: 14 },
  'Copperleaf Butterhead': { dd: 540, heatDays: 6 },
  'Marbleridge Romaine': { dd: 520, heatDays: 2 },
  Tealshield: { dd: 380, heatDays: 7 },
  'Longwinter Savoy': { dd: 420, heatDays: 2 },
};

/**
 * Plantings placed back from the seeding day in the garden that is in season then, so Today has
 * something true in every section whatever the date: with the season's long days a quick-bolting
 * cilantro near maturity is at high bolt risk, a slow-bolting one elevated, a young very
 * slow-bolting lettuce low, and a pea past its packet days has its harvest window open.
 */
const IN_SEASON: Array<{ variety: string; bed: number; daysAgo: number; emerge: number; quantity: [number, 'plants' | 'row-m'] }> = [
  { variety: 'Brightstem', bed: 5, daysAgo: 40, emerge: 9, quantity: [2, 'row-m'] },
  { variety: 'Slowhand', bed: 12, daysAgo: 44, emerge: 10, quantity: [12, 'plants'] },
  { variety: 'Summerhold Batavian', bed: 6, daysAgo: 14, emerge: 6, quantity: [18, 'plants'] },
  { variety: 'Lanternpod Snap', bed: 11, daysAgo: 64, emerge: 10, quantity: [4, 'row-m'] },
];

/** The hemisphere whose days are the longer today is the one in its growing season. */
export function inSeason(latitude: number, today: string): boolean {
  return dayLengthHours(latitude, today) >= dayLengthHours(-latitude, today);
}

const BED_NAMES = {
  N: ['North 1', 'North 2', 'North 3', 'North 4', 'South 1', 'South 2', 'South 3', 'South 4', 'Greenhouse bench', 'Fence row', 'Tub A', 'Tub B'],
  S: ['Plot 1', 'Plot 2', 'Plot 3', 'Plot 4', 'Plot 5', 'Plot 6', 'Plot 7', 'Plot 8', 'Shade-house bench', 'Trellis row', 'Wicking tub 1', 'Wicking tub 2'],
} as const;

interface Ctx {
  garden: Garden;
  users: User[];
  today: string;
  transaction: Transaction;
  /** The garden's weather will be fetched: lettuce and spinach outcomes are left for it to decide. */
  weatherDecides: boolean;
}

async function seedBeds({ garden, transaction }: Ctx, hemisphere: 'N' | 'S') {
  const beds: Bed[] = [];
  for (const [i, name] of BED_NAMES[hemisphere].entries()) {
    const container = i >= 10;
    const [bed] = await Bed.findOrCreate({
      where: { gardenId: garden.id, name },
      defaults: {
        gardenId: garden.id,
        name,
        kind: container ? 'container' : i === 8 ? 'raised-bed' : i === 9 ? 'row' : 'bed',
        lengthM: container ? 0.8 : i === 9 ? 8 : 3,
        widthM: container ? 0.5 : i === 9 ? 0.4 : 1.2,
        notes: container ? 'Self-watering container by the shed.' : '',
      },
      transaction,
    });
    beds.push(bed);
  }
  return beds;
}

async function seedVarieties({ garden, transaction }: Ctx) {
  const out = new Map<string, Variety>();
  for (const seed of DEMO_VARIETIES) {
    const [variety] = await Variety.findOrCreate({
      where: { gardenId: garden.id, cropKey: seed.cropKey, name: seed.name },
      defaults: {
        gardenId: garden.id,
        notes: '',
        sunHours: 6,
        waterCmPerWeek: 2.5,
        thinSpacingCm: null,
        gddTargetOverrideC: null,
        ...seed,
      },
      transaction,
    });
    out.set(seed.name, variety);
  }
  return out;
}

/** Seed lots of several ages; older lots carry germination tests, as a careful grower would do. */
async function seedLots({ garden, today, transaction }: Ctx, varieties: Map<string, Variety>) {
  const year = Number(today.slice(0, 4));
  const lots = new Map<string, SeedLot>();
  const ages = [0, 1, 3, 5];
  let n = 0;
  for (const [name, variety] of varieties) {
    const age = ages[n % ages.length];
    const lotNumber = `HC-${String(garden.id).padStart(2, '0')}${String(++n).padStart(3, '0')}`;
    const [lot] = await SeedLot.findOrCreate({
      where: { gardenId: garden.id, varietyId: variety.id, lotNumber },
      defaults: {
        gardenId: garden.id,
        varietyId: variety.id,
        supplier: n % 2 ? 'Meadowbank Seed Co-op' : 'Tinpan Seed Library',
        lotNumber,
        packedForYear: year - age,
        // Large seed is weighed, small seed counted.
        quantity: variety.cropKey === 'pea' || variety.cropKey === 'snap-bean' ? 120 : 400,
        quantityUnit: variety.cropKey === 'pea' || variety.cropKey === 'snap-bean' ? 'grams' : 'seeds',
        storageNotes: 'Sealed jar with silica gel, cellar shelf.',
      },
      transaction,
    });
    lots.set(name, lot);
    if (age >= 1) {
      const testedOn = addDays(today, -30 - age * 7);
      const germinated = Math.max(4, 19 - age * 2 - (n % 3));
      await GerminationTest.findOrCreate({
        where: { seedLotId: lot.id, testedOn },
        defaults: { gardenId: garden.id, seedLotId: lot.id, testedOn, seedsTested: 20, germinated, notes: 'Rag-doll test on a warm shelf.' },
        transaction,
      });
    }
  }
  return lots;
}

interface Event {
  on: string;
  kind: 'watered' | 'fed' | 'thinned' | 'observation' | 'harvest' | 'bolted';
  note: string;
  amount?: [number, 'kg' | 'bunches' | 'count'];
}

function statusAt(events: { harvestFrom?: string; harvestTo?: string; bolt?: string }, start: string, today: string): PlantingStatus {
  if (start > today) return 'planned';
  if (events.bolt && events.bolt <= today) return 'bolted';
  if (events.harvestTo && events.harvestTo <= today) return 'harvested';
  return 'growing';
}

async function seedInSeason(ctx: Ctx, beds: Bed[], varieties: Map<string, Variety>, lots: Map<string, SeedLot>) {
  const { garden, users, today, transaction } = ctx;
  if (!inSeason(garden.latitude ?? 0, today)) return;
  for (const [i, t] of IN_SEASON.entries()) {
    const sown = addDays(today, -t.daysAgo);
    const planting = await Planting.create(
      {
        gardenId: garden.id,
        bedId: beds[t.bed - 1].id,
        varietyId: varieties.get(t.variety)!.id,
        seedLotId: lots.get(t.variety)!.id,
        method: 'direct-sow',
        status: 'growing',
        quantity: t.quantity[0],
        quantityUnit: t.quantity[1],
        sownOn: sown,
        emergedOn: addDays(sown, t.emerge),
        thinnedOn: null,
        transplantedOn: null,
        firstHarvestOn: null,
        lastHarvestOn: null,
        boltedOn: null,
        notes: '',
        createdBy: users[i % users.length].id,
      },
      { transaction },
    );
    await PlantingLog.create(
      { gardenId: garden.id, plantingId: planting.id, entryOn: addDays(sown, t.emerge), kind: 'observation', amount: null, amountUnit: null, note: 'Up and even along the row.', photoId: null, createdBy: users[(i + 1) % users.length].id },
      { transaction },
    );
  }
}

/** A demo planting whose harvest and bolting are left for the garden's weather to decide (demo-outcomes.ts). */
export interface PendingOutcome {
  plantingId: number;
  variety: string;
  /** Days the picking lasts once it starts, from the template. */
  pickingDays: number;
  /** The planting's creator and the other members, for the log entries. */
  authors: number[];
}

async function seedPlantings(ctx: Ctx, beds: Bed[], varieties: Map<string, Variety>, lots: Map<string, SeedLot>): Promise<PendingOutcome[]> {
  const { garden, users, today, transaction } = ctx;
  const pending: PendingOutcome[] = [];
  if (await Planting.count({ where: { gardenId: garden.id }, transaction })) return pending;
  await seedInSeason(ctx, beds, varieties, lots);
  const latitude = garden.latitude ?? 0;
  const current = seasonOf(today, latitude);
  for (let s = 0; s < 4; s++) {
    const seasonStart = `${current.startYear - 3 + s}-${latitude < 0 ? '07' : '01'}-01`;
    const jitter = [3, -4, 6, 0][s];
    for (const [i, t] of TEMPLATES.entries()) {
      const variety = varieties.get(t.variety)!;
      const start = addDays(seasonStart, t.day + jitter);
      const at = (d: number | undefined) => (d === undefined ? undefined : addDays(start, d));
      const known = (d: string | undefined) => (d && d <= today ? d : null);
      const byWeather = ctx.weatherDecides && DEMO_VARIETY_TRUTH[t.variety] !== undefined;
      const bolts = !byWeather && t.bolt && t.bolt.seasons.includes(s) ? at(t.bolt.after) : undefined;
      const harvestFrom = !byWeather && t.harvest && (!bolts || at(t.harvest[0])! < bolts) ? at(t.harvest[0]) : undefined;
      const harvestTo = !byWeather && t.harvest ? (bolts ? (harvestFrom ? bolts : undefined) : at(t.harvest[1])) : undefined;
      const status = statusAt({ harvestFrom, harvestTo, bolt: bolts }, start, today);
      const indoor = t.method === 'indoor-start';
      const transplanted = t.method === 'transplant' ? start : at(t.transplant);
      const planting = await Planting.create(
        {
          gardenId: garden.id,
          bedId: beds[t.bed - 1].id,
          varietyId: variety.id,
          seedLotId: t.method === 'transplant' ? null : lots.get(t.variety)!.id,
          method: t.method,
          status,
          quantity: t.quantity[0],
          quantityUnit: t.quantity[1],
          sownOn: t.method === 'transplant' ? null : start,
          emergedOn: known(at(t.emerge)),
          thinnedOn: known(at(t.thin)),
          transplantedOn: status === 'planned' ? (t.method === 'transplant' ? start : null) : known(transplanted),
          firstHarvestOn: known(harvestFrom),
          lastHarvestOn: status === 'harvested' || status === 'bolted' ? known(harvestTo ?? undefined) : null,
          boltedOn: known(bolts),
          notes: indoor ? 'Started under lights in the classroom.' : '',
          createdBy: users[i % users.length].id,
        },
        { transaction },
      );
      if (byWeather && status !== 'planned') {
        const authors = users.map((u) => u.id);
        pending.push({ plantingId: planting.id, variety: t.variety, pickingDays: t.harvest ? t.harvest[1] - t.harvest[0] : 10, authors: [...authors.slice(i % authors.length), ...authors.slice(0, i % authors.length)] });
      }
      const events: Event[] = [];
      if (t.thin !== undefined) events.push({ on: at(t.thin)!, kind: 'thinned', note: 'Thinned to the final spacing.' });
      events.push({ on: at(indoor ? (t.transplant ?? 0) + 3 : 2)!, kind: 'watered', note: 'Deep soak after a dry spell.' });
      if (indoor || t.variety.includes('Pole')) events.push({ on: at((t.transplant ?? 20) + 25)!, kind: 'fed', note: 'Side-dressed with compost.' });
      if (harvestFrom) {
        events.push({ on: harvestFrom, kind: 'harvest', note: 'First picking.', amount: [indoor ? 1.2 : 0.6, 'kg'] });
        if (harvestTo && harvestTo !== harvestFrom) events.push({ on: harvestTo, kind: 'harvest', note: 'Final picking.', amount: [indoor ? 2.5 : 0.8, 'kg'] });
      }
      if (bolts) {
        events.push({ on: addDays(bolts, -4), kind: 'observation', note: 'Centres elongating after the hot spell.' });
        events.push({ on: bolts, kind: 'bolted', note: 'Seed stalks showing; pulled for compost.' });
      }
      for (const [k, e] of events.entries()) {
        if (e.on > today || e.on < start) continue;
        await PlantingLog.create(
          {
            gardenId: garden.id,
            plantingId: planting.id,
            entryOn: e.on,
            kind: e.kind,
            amount: e.amount?.[0] ?? null,
            amountUnit: e.amount?.[1] ?? null,
            note: e.note,
            photoId: null,
            createdBy: users[(i + k) % users.length].id,
          },
          { transaction },
        );
      }
    }
  }
  return pending;
}

/**
 * Beds, varieties, seed lots and (into a garden without plantings) the seasons of plantings.
 * With `weatherDecides`, the lettuce and spinach plantings that have started are returned without
 * harvest or bolting, for settleDemoOutcomes once the garden's weather is in.
 */
export async function seedGardenRecords(garden: Garden, users: User[], today: string, transaction: Transaction, opts: { weatherDecides?: boolean } = {}): Promise<PendingOutcome[]> {
  const ctx: Ctx = { garden, users, today, transaction, weatherDecides: opts.weatherDecides ?? false };
  const beds = await seedBeds(ctx, (garden.latitude ?? 0) < 0 ? 'S' : 'N');
  const varieties = await seedVarieties(ctx);
  const lots = await seedLots(ctx, varieties);
  return seedPlantings(ctx, beds, varieties, lots);
}
