// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { GardenDto } from '#shared/schemas/gardens';
import type { PlaceDto } from '#shared/schemas/places';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

const hobart: PlaceDto = {
  name: 'Hobart',
  region: null,
  country: 'Australia',
  countryCode: 'AU',
  postalCode: null,
  latitude: -42.87936,
  longitude: 147.32941,
  timeZone: 'Australia/Hobart',
  source: 'geonames',
};
const hobartIndiana: PlaceDto = { ...hobart, region: 'Indiana', country: 'United States', countryCode: 'US', latitude: 41.53226, longitude: -87.25504, timeZone: 'America/Chicago' };

function settingsWithPlaces(items: PlaceDto[]) {
  let stored = aGarden({ latitude: null, longitude: null, hemisphere: 'N', timeZone: 'UTC' });
  server.use(
    signedInAs(grower),
    http.get('/api/gardens', () => HttpResponse.json({ gardens: [stored] })),
    ...memberOf([stored]),
    http.get('/api/places', () => HttpResponse.json({ items })),
    http.patch('/api/gardens/:gardenId', async ({ request }) => {
      stored = { ...stored, ...((await request.json()) as Partial<GardenDto>) };
      return HttpResponse.json({ garden: stored });
    }),
  );
  return renderApp('/g/1/settings');
}

describe('finding the garden by town or ZIP code in garden settings', () => {
  it('when the owner searches with Enter and uses a match, then the fields show its numbers and one PATCH saves them', async () => {
    const { user } = settingsWithPlaces([hobart, hobartIndiana]);
    const search = await screen.findByLabelText('Find the garden by town or US ZIP code');
    await user.type(search, 'Hobart{Enter}');
    // Enter searched; it did not save the settings.
    expect(await screen.findByText('2 matches, the likeliest first: choose yours.')).toBeTruthy();
    expect(seen.filter((r) => r.method === 'PATCH')).toHaveLength(0);
    expect(seen.find((r) => r.path === '/api/places')?.query.get('q')).toBe('Hobart');
    expect(screen.getByText('42.8794° S, 147.3294° E · Australia/Hobart')).toBeTruthy();
    expect(screen.getByText('Hobart, Indiana, United States')).toBeTruthy();
    expect(screen.getByText(/GeoNames \(geonames.org, CC BY 4.0\)/)).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Use Hobart, Australia' }));
    expect(screen.getByText('Filled in from Hobart, Australia')).toBeTruthy();
    expect((screen.getByLabelText('Latitude (decimal degrees, °)') as HTMLInputElement).value).toBe('-42.87936');
    expect((screen.getByLabelText('Longitude (decimal degrees, °)') as HTMLInputElement).value).toBe('147.32941');
    expect((screen.getByLabelText('Time zone') as HTMLInputElement).value).toBe('Australia/Hobart');
    // Still the grower's to correct before saving.
    await user.clear(screen.getByLabelText('Longitude (decimal degrees, °)'));
    await user.type(screen.getByLabelText('Longitude (decimal degrees, °)'), '147.3');
    await user.click(screen.getByRole('button', { name: 'Save settings' }));
    expect(await screen.findByText('Settings saved.')).toBeTruthy();
    const patch = seen.filter((r) => r.method === 'PATCH');
    expect(patch).toHaveLength(1);
    expect(patch[0]!.body).toMatchObject({ latitude: -42.87936, longitude: 147.3, timeZone: 'Australia/Hobart' });
  });

  it('when nothing matches or the words are too short, then it says so and the coordinates can still be typed', async () => {
    const { user } = settingsWithPlaces([]);
    const search = await screen.findByLabelText('Find the garden by town or US ZIP code');
    await user.type(search, 'x');
    await user.click(screen.getByRole('button', { name: 'Find' }));
    expect(screen.getByText('Type at least 2 letters of the place, or a 5-digit US ZIP code.')).toBeTruthy();
    expect(seen.some((r) => r.path === '/api/places')).toBe(false);
    await user.type(search, 'zq');
    await user.click(screen.getByRole('button', { name: 'Find' }));
    expect(await screen.findByText(/No town or ZIP code matches “xzq”/)).toBeTruthy();
  });
});
