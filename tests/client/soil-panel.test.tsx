// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { GardenSoilResponse } from '#shared/schemas/soil';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const today = new Date().toISOString().slice(0, 10);
function aSoil(temperature: number, readings: GardenSoilResponse['readings'] = []): GardenSoilResponse {
  return {
    unit: 'F',
    current: { date: today, temperature, source: 'reading' },
    forecast: [{ date: today, temperature: 49.5 }],
    readings,
    crops: [
      { key: 'snap-bean', name: 'Snap bean', season: 'warm', status: 'too-cold', emergenceDays: null, interpolated: false, germ: { min: 60, opt: 80, max: 95 }, words: 'Too cold: below its 60 °F minimum the seed is likely to rot — wait for 60 °F.' },
      { key: 'spinach', name: 'Spinach', season: 'cool', status: 'cool', emergenceDays: 13.9, interpolated: true, germ: { min: 35, opt: 70, max: 85 }, words: 'Slow but sowable: comes up in about 14 days.' },
    ],
    emergenceSource: 'Harrington & Minges 1954',
  };
}

function planWithSoil(role: 'grower' | 'viewer', first: GardenSoilResponse, afterPost?: GardenSoilResponse) {
  let current = first;
  // Listed before memberOf, whose quiet defaults (no soil known) would answer first.
  server.use(
    http.get('/api/gardens/1/soil', () => HttpResponse.json(current)),
    http.post('/api/gardens/1/soil/readings', () => {
      if (afterPost) current = afterPost;
      return HttpResponse.json({ reading: afterPost?.readings[0] }, { status: 201 });
    }),
    signedInAs(grower),
    ...memberOf([aGarden({ role, timeZone: 'UTC' })]),
    http.get('/api/gardens/1/varieties', () => HttpResponse.json({ items: [], page: 1, pageSize: 200, total: 0 })),
  );
  return renderApp('/g/1/plan');
}

describe('soil temperature and sowing now, on the Plan page', () => {
  it('when the soil is known, then it says where the figure came from and what it means for each crop, in words, the sowable first', async () => {
    planWithSoil('viewer', aSoil(48.2));
    expect(await screen.findByText(/Soil now: 48\.2 °F .*\(your thermometer\)\./)).toBeTruthy();
    const table = screen.getByRole('table', { name: /Whether the soil suits sowing each crop now/ });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows.map((r) => within(r).getByRole('rowheader').textContent)).toEqual(['Spinach', 'Snap bean']);
    expect(within(rows[0]!).getByText('Slow but sowable: comes up in about 14 days.')).toBeTruthy();
    expect(within(rows[1]!).getByText('60–95 °F')).toBeTruthy();
    expect(within(rows[1]!).getByText('Too cold')).toBeTruthy();
    // A viewer reads; only growers write readings.
    expect(screen.queryByRole('form', { name: 'Add a soil reading' })).toBeNull();
  });

  it('when a grower saves a thermometer reading, then one POST carries it with its key and the advice reloads', async () => {
    const saved = { id: 4, readOn: today, temperature: 52, depthCm: 5, note: 'by the shed', by: 'Mara Quill' };
    const { user } = planWithSoil('grower', aSoil(48.2), aSoil(52, [saved]));
    const form = await screen.findByRole('form', { name: 'Add a soil reading' });
    await user.type(within(form).getByLabelText('Soil temperature (°F)'), 'warm');
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));
    expect(await within(form).findByText('Type the thermometer’s figure in °F, e.g. 52.')).toBeTruthy();
    expect(seen.filter((r) => r.method === 'POST')).toHaveLength(0);

    await user.clear(within(form).getByLabelText('Soil temperature (°F)'));
    await user.type(within(form).getByLabelText('Soil temperature (°F)'), '52');
    await user.type(within(form).getByLabelText('Depth (cm, optional)'), '5');
    await user.type(within(form).getByLabelText('Note (optional)'), 'by the shed');
    await user.click(within(form).getByRole('button', { name: 'Save reading' }));
    expect(await screen.findByText('Reading saved')).toBeTruthy();
    const posts = seen.filter((r) => r.method === 'POST');
    expect(posts).toHaveLength(1);
    expect(posts[0]!.body).toEqual({ readOn: today, temperature: 52, depthCm: 5, note: 'by the shed' });
    expect(posts[0]!.headers.get('Idempotency-Key')).toBeTruthy();
    await waitFor(() => expect(screen.getByText(/Soil now: 52\.0 °F/)).toBeTruthy());
    expect(screen.getByText(/by Mara Quill/)).toBeTruthy();
  });

  it('when nothing is known of the soil, then it says how to get a figure instead of advising', async () => {
    planWithSoil('grower', { ...aSoil(0), current: null, crops: [], forecast: [] });
    expect(await screen.findByText(/No soil temperature yet/)).toBeTruthy();
    expect(screen.queryByRole('table', { name: /Whether the soil suits/ })).toBeNull();
  });
});
