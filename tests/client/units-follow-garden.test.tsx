// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { BedDto } from '#shared/schemas/beds';
import { bedCreateSchema } from '#shared/schemas/beds';
import type { GardenDto } from '#shared/schemas/gardens';
import type { LogEntryDto } from '#shared/schemas/plantings';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aBed, aCelsiusProgress, aGarden, aPlanting, aProgress, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

// 10 × 4 ft exactly (1 ft = 0.3048 m); the server rounds the area to 0.01 m².
const tenByFour = aBed({ lengthM: 3.048, widthM: 1.2192, areaM2: 3.72 });
const celsius = aGarden({ id: 2, name: 'Wattle Creek School Garden', units: 'C', timeZone: 'Australia/Melbourne', latitude: -37.81, longitude: 144.96, hemisphere: 'S' });

function bedsOf(garden: GardenDto, beds: BedDto[]) {
  return [
    signedInAs(grower),
    ...memberOf([garden]),
    http.get(`/api/gardens/${garden.id}/beds`, () => HttpResponse.json({ items: beds, page: 1, pageSize: 200, total: beds.length })),
  ];
}

const writes = () => seen.filter((r) => r.method === 'POST' || r.method === 'PATCH');

describe('beds in the garden’s units', () => {
  it('when a °F garden shows a bed stored as 3.048 × 1.2192 m, then it reads 10 × 4 ft and 40 sq ft', async () => {
    server.use(...bedsOf(aGarden(), [tenByFour]));
    renderApp('/g/1/beds');

    expect(await screen.findByText('10 × 4 ft · 40 sq ft')).toBeTruthy();
    expect(screen.queryByText(/ m\b|m²/u)).toBeNull();
    expect(screen.getByLabelText('Length (ft)')).toBeTruthy();
  });

  it('when a °C garden shows the same bed, then it reads metres and square metres', async () => {
    server.use(...bedsOf(celsius, [tenByFour]));
    renderApp('/g/2/beds');

    expect(await screen.findByText('3.05 × 1.22 m · 3.7 m²')).toBeTruthy();
    expect(screen.queryByText(/\bft\b/u)).toBeNull();
    expect(screen.getByLabelText('Length (m)')).toBeTruthy();
  });

  it('when a °F grower edits a bed, then the form starts in feet and the PATCH carries the metres of the feet typed', async () => {
    server.use(
      ...bedsOf(aGarden(), [tenByFour]),
      http.patch('/api/gardens/1/beds/3', () => HttpResponse.json({ bed: { ...tenByFour, lengthM: 3.6576, areaM2: 4.46 } })),
    );
    const { user } = renderApp('/g/1/beds');
    await screen.findByText('10 × 4 ft · 40 sq ft');
    await user.click(screen.getByRole('button', { name: 'Edit bed North 1' }));

    const form = screen.getByRole('form', { name: 'Edit bed North 1' });
    const length = within(form).getByLabelText('Length (ft)');
    expect((length as HTMLInputElement).value).toBe('10');
    expect((within(form).getByLabelText('Width (ft)') as HTMLInputElement).value).toBe('4');
    await user.clear(length);
    await user.type(length, '12');
    await user.click(within(form).getByRole('button', { name: 'Save changes' }));

    await waitFor(() => expect(writes()).toHaveLength(1));
    expect(writes()[0].body).toEqual({ lengthM: 3.6576 });
  });

  it('when a °F grower types sides out of bounds in feet, then the messages name feet and nothing is sent', async () => {
    server.use(...bedsOf(aGarden(), []));
    const { user } = renderApp('/g/1/beds');
    const form = await screen.findByRole('form', { name: 'New bed' });
    await user.type(within(form).getByLabelText('Name'), 'Herb spiral');
    await user.type(within(form).getByLabelText('Length (ft)'), '0.3');
    await user.type(within(form).getByLabelText('Width (ft)'), '4000');
    await user.click(within(form).getByRole('button', { name: 'Add bed' }));

    expect(await within(form).findByText('Length must be at least 0.4 ft.')).toBeTruthy();
    expect(within(form).getByText('Width must be at most 3280.8 ft.')).toBeTruthy();
    expect(writes()).toHaveLength(0);
  });

  it('when the bounds the form takes in feet are sent, then the server’s own schema takes their metres', async () => {
    server.use(
      ...bedsOf(aGarden(), []),
      http.post('/api/gardens/1/beds', () => HttpResponse.json({ bed: aBed({ id: 9, name: 'Herb spiral', lengthM: 0.1219, widthM: 999.9878 }) }, { status: 201 })),
    );
    const { user } = renderApp('/g/1/beds');
    const form = await screen.findByRole('form', { name: 'New bed' });
    await user.type(within(form).getByLabelText('Name'), 'Herb spiral');
    await user.type(within(form).getByLabelText('Length (ft)'), '0.4');
    await user.type(within(form).getByLabelText('Width (ft)'), '3280.8');
    await user.click(within(form).getByRole('button', { name: 'Add bed' }));

    await waitFor(() => expect(writes()).toHaveLength(1));
    const body = writes()[0].body as Record<string, unknown>;
    expect(body).toMatchObject({ name: 'Herb spiral', lengthM: 0.1219, widthM: 999.9878 });
    expect(bedCreateSchema.safeParse(body).success).toBe(true);
  });
});

describe('a bed’s plantings', () => {
  it('when a bed’s card is followed, then the plantings list asks for that bed only, says which, and can show every bed again', async () => {
    server.use(
      ...bedsOf(aGarden(), [tenByFour]),
      http.get('/api/gardens/1/plantings', () => HttpResponse.json({ items: [aPlanting()], page: 1, pageSize: 25, total: 1 })),
    );
    const { user, router } = renderApp('/g/1/beds');
    await screen.findByText('10 × 4 ft · 40 sq ft');
    const link = screen.getByRole('link', { name: 'Plantings in North 1' });
    expect(link.getAttribute('href')).toBe('/g/1/plantings?bed=3');
    await user.click(link);

    expect(await screen.findByRole('heading', { level: 1, name: 'Plantings in North 1' })).toBeTruthy();
    const lists = () => seen.filter((r) => r.path === '/api/gardens/1/plantings');
    await waitFor(() => expect(lists().length).toBeGreaterThan(0));
    expect(lists().map((r) => r.query.get('bedId'))).toEqual(lists().map(() => '3'));

    await user.click(screen.getByRole('button', { name: 'Show plantings in every bed' }));
    expect(await screen.findByRole('heading', { level: 1, name: 'Plantings' })).toBeTruthy();
    expect(router.state.location.search).toBe('');
    await waitFor(() => expect(lists().at(-1)!.query.get('bedId')).toBeNull());
  });
});

function logEntry(overrides: Partial<LogEntryDto>): LogEntryDto {
  return { id: 1, entryOn: '2025-06-20', kind: 'harvest', amount: null, amountUnit: null, note: '', photoId: null, by: 'Mara Quill', createdAt: '2025-06-20T10:00:00.000Z', ...overrides };
}

function plantingPage(garden: GardenDto, entries: LogEntryDto[]) {
  const base = `/api/gardens/${garden.id}/plantings/5`;
  return [
    signedInAs(grower),
    ...memberOf([garden]),
    http.get(base, () => HttpResponse.json({ planting: aPlanting() })),
    http.get(`${base}/progress`, () => HttpResponse.json(garden.units === 'C' ? aCelsiusProgress() : aProgress())),
    http.get(`${base}/log`, () => HttpResponse.json({ items: entries, page: 1, pageSize: 200, total: entries.length })),
    http.get(`${base}/photos`, () => HttpResponse.json({ photos: [] })),
  ];
}

describe('harvests in the garden’s units', () => {
  const entries = [
    logEntry({ id: 1, amount: 1, amountUnit: 'kg' }),
    logEntry({ id: 2, entryOn: '2025-06-27', amount: 250, amountUnit: 'g' }),
    logEntry({ id: 3, entryOn: '2025-07-02', amount: 12, amountUnit: 'count' }),
  ];
  const log = () => screen.getByRole('region', { name: /^Log/u });
  /** One entry's line, read whole: "Harvest · 20 Jun 2025 · 2 lb 3 oz". */
  const line = (text: string) => within(log()).findByText((_, el) => el?.tagName === 'P' && el.textContent === text);

  it('when a °F garden’s log holds masses typed in kg and g, then they read in pounds and ounces, and counts as typed', async () => {
    server.use(...plantingPage(aGarden({ role: 'viewer' }), entries));
    renderApp('/g/1/plantings/5');

    await screen.findByRole('region', { name: /^Log/u });
    expect(await line('Harvest · 20 Jun 2025 · 2 lb 3 oz')).toBeTruthy();
    expect(await line('Harvest · 27 Jun 2025 · 9 oz')).toBeTruthy();
    expect(await line('Harvest · 2 Jul 2025 · 12 pieces')).toBeTruthy();
    expect(log().textContent).not.toMatch(/\bkg\b|\d g\b/u);
  });

  it('when a °C garden’s log holds the same, then kilograms read as kilograms and grams under a kilogram stay grams', async () => {
    server.use(...plantingPage({ ...celsius, role: 'viewer' }, [...entries, logEntry({ id: 4, entryOn: '2025-07-09', amount: 2, amountUnit: 'lb' })]));
    renderApp('/g/2/plantings/5');

    await screen.findByRole('region', { name: /^Log/u });
    expect(await line('Harvest · 20 Jun 2025 · 1 kg')).toBeTruthy();
    expect(await line('Harvest · 27 Jun 2025 · 250 g')).toBeTruthy();
    expect(await line('Harvest · 9 Jul 2025 · 0.91 kg')).toBeTruthy();
    expect(log().textContent).not.toMatch(/\blb\b|\boz\b/u);
  });
});
