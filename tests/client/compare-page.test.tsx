// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { CompareDto, ComparePlantingDto } from '#shared/schemas/compare';
import type { VarietyDto } from '#shared/schemas/varieties';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';
import { CLIENT_WAIT_MS } from './helpers/waits';

setupClientTests();

// Invented varieties, in the spirit of the demo garden.
const variety = (id: number, name: string) => ({ id, crop: { key: 'lettuce', name: 'Lettuce', season: 'cool' }, name }) as unknown as VarietyDto;

function planting(p: Partial<ComparePlantingDto> & Pick<ComparePlantingDto, 'plantingId' | 'varietyId'>): ComparePlantingDto {
  return {
    season: 2025,
    seasonLabel: '2025',
    startOn: '2025-04-01',
    firstHarvestOn: null,
    boltedOn: null,
    daysToHarvest: null,
    ddToHarvest: null,
    daysToBolt: null,
    ddToBolt: null,
    heatDays: null,
    longestHotStreak: null,
    heatUntil: null,
    dayLengthAtBolt: null,
    boltedBeforeHarvest: null,
    ...p,
  };
}

const medians = { daysToHarvest: null, ddToHarvest: null, daysToBolt: null, ddToBolt: null, heatDays: null, longestHotStreak: null, dayLengthAtBolt: null };

function aComparison(): CompareDto {
  return {
    crop: { key: 'lettuce', name: 'Lettuce' },
    unit: 'F',
    heatThreshold: 80.6,
    seasons: [
      { year: 2024, label: '2024' },
      { year: 2025, label: '2025' },
    ],
    availableSeasons: [
      { year: 2024, label: '2024' },
      { year: 2025, label: '2025' },
    ],
    varieties: [
      { varietyId: 2, name: 'Emberproof Cos', plantings: 3, withOutcome: 3, boltedBeforeHarvestShare: 0.33, medians, rank: 1, evidence: 'Bolted after a median of 9 heat days (highs above 80.6 °F) across 3 plantings.', caution: null },
      { varietyId: 1, name: 'Copperleaf Butterhead', plantings: 1, withOutcome: 1, boltedBeforeHarvestShare: 1, medians, rank: 2, evidence: 'Bolted after a median of 4 heat days (highs above 80.6 °F) across 1 planting.', caution: 'Only 1 planting backs this rank: treat it as a first hint and keep recording.' },
    ],
    plantings: [
      planting({ plantingId: 11, varietyId: 1, boltedOn: '2025-05-05', daysToBolt: 34, ddToBolt: 718.4, heatDays: 4, longestHotStreak: 4, heatUntil: 'bolt', dayLengthAtBolt: 14.4, boltedBeforeHarvest: true }),
      planting({ plantingId: 21, varietyId: 2, season: 2024, seasonLabel: '2024', startOn: '2024-04-01', boltedOn: '2024-05-12', daysToBolt: 41, ddToBolt: 900.2, heatDays: 9, longestHotStreak: 8, heatUntil: 'bolt', dayLengthAtBolt: 14.7, boltedBeforeHarvest: true }),
      planting({ plantingId: 22, varietyId: 2, firstHarvestOn: '2025-05-21', daysToHarvest: 50, ddToHarvest: 1257, heatDays: 19, longestHotStreak: 10, heatUntil: 'harvest', boltedBeforeHarvest: false }),
      planting({ plantingId: 23, varietyId: 2, boltedOn: '2025-05-09', daysToBolt: 38, ddToBolt: 850, heatDays: 7, longestHotStreak: 7, heatUntil: 'bolt', dayLengthAtBolt: 14.6, boltedBeforeHarvest: true }),
    ],
    method: 'Figures come from each planting’s records and the garden’s weather.',
  };
}

describe('compare page', () => {
  it('when a crop is compared, then the ranking is in words, the legend names each season’s shape, the table sorts, and seasons change the query', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'viewer' })]),
      http.get('/api/gardens/1/varieties', () => HttpResponse.json({ items: [variety(1, 'Copperleaf Butterhead'), variety(2, 'Emberproof Cos')], page: 1, pageSize: 200, total: 2 })),
      http.get('/api/gardens/1/compare', () => HttpResponse.json(aComparison())),
    );
    renderApp('/g/1/compare');

    const ranking = (await screen.findByRole('heading', { name: 'Heat tolerance, most tolerant first' }, { timeout: CLIENT_WAIT_MS })).parentElement!;
    const items = within(ranking).getAllByRole('listitem');
    expect(items[0].textContent).toContain('1. Emberproof Cos');
    expect(items[0].textContent).toContain('Bolted after a median of 9 heat days (highs above 80.6 °F) across 3 plantings.');
    expect(items[1].textContent).toContain('2. Copperleaf Butterhead');
    expect(within(items[1]).getByText('Only 1 planting backs this rank: treat it as a first hint and keep recording.')).toBeTruthy();

    const legend = screen.getByRole('list', { name: 'Seasons on the chart' });
    expect(within(legend).getAllByRole('listitem').map((li) => li.textContent)).toEqual(['2024: circle', '2025: triangle']);

    const table = screen.getByRole('table');
    const firstColumn = () => within(table).getAllByRole('rowheader').map((c) => c.textContent);
    const heatHeader = within(table).getByRole('columnheader', { name: /Heat days \(high above 80.6 °F\)/ });
    expect(heatHeader.getAttribute('aria-sort')).toBe('descending');
    expect(within(table).getAllByRole('row')[1].textContent).toContain('19 before harvest');
    expect(within(table).getByText('1,257.0 °F-days')).toBeTruthy();
    fireEvent.click(within(heatHeader).getByRole('button'));
    expect(heatHeader.getAttribute('aria-sort')).toBe('ascending');
    expect(within(table).getAllByRole('row')[1].textContent).toContain('4 before bolting');
    const varietyHeader = within(table).getByRole('columnheader', { name: 'Variety' });
    fireEvent.click(within(varietyHeader).getByRole('button'));
    expect(varietyHeader.getAttribute('aria-sort')).toBe('ascending');
    expect(heatHeader.getAttribute('aria-sort')).toBe('none');
    expect(firstColumn()[0]).toBe('Copperleaf Butterhead');

    expect(screen.getByRole('link', { name: 'Download CSV' }).getAttribute('href')).toBe('/api/gardens/1/compare.csv?crop=lettuce');
    await screen.findByRole('figure', { name: /Heat days and degree days of each lettuce planting/ }, { timeout: CLIENT_WAIT_MS });

    const compares = () => seen.filter((r) => r.path === '/api/gardens/1/compare');
    expect(compares().at(-1)!.query.get('crop')).toBe('lettuce');
    expect(compares().at(-1)!.query.get('seasons')).toBeNull();
    fireEvent.click(screen.getByRole('checkbox', { name: '2024' }));
    await waitFor(() => expect(compares().at(-1)!.query.get('seasons')).toBe('2025'));
    expect(screen.getByRole('link', { name: 'Download CSV' }).getAttribute('href')).toBe('/api/gardens/1/compare.csv?crop=lettuce&seasons=2025');
  });

  it('when the page opens, then it compares the crop with the most varieties (or the one in the address), and counts read "1 day"', async () => {
    const arugula = { id: 5, crop: { key: 'arugula', name: 'Arugula', season: 'cool' }, name: 'Peppertooth' } as unknown as VarietyDto;
    const oneDay = aComparison();
    oneDay.plantings[0] = { ...oneDay.plantings[0], longestHotStreak: 1 };
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'viewer' })]),
      http.get('/api/gardens/1/varieties', () => HttpResponse.json({ items: [arugula, variety(1, 'Copperleaf Butterhead'), variety(2, 'Emberproof Cos')], page: 1, pageSize: 200, total: 3 })),
      http.get('/api/gardens/1/compare', () => HttpResponse.json(oneDay)),
    );
    renderApp('/g/1/compare');
    // Arugula comes first by name, but lettuce has two varieties to compare.
    expect(((await screen.findByRole('combobox', { name: 'Crop' }, { timeout: CLIENT_WAIT_MS })) as HTMLSelectElement).value).toBe('lettuce');
    const table = await screen.findByRole('table', {}, { timeout: CLIENT_WAIT_MS });
    expect(within(table).getByText('1 day')).toBeTruthy();
    const compares = () => seen.filter((r) => r.path === '/api/gardens/1/compare');
    expect(compares().at(-1)!.query.get('crop')).toBe('lettuce');
    fireEvent.change(screen.getByRole('combobox', { name: 'Crop' }), { target: { value: 'arugula' } });
    await waitFor(() => expect(compares().at(-1)!.query.get('crop')).toBe('arugula'));
  });

  it('when the address names a crop, then that crop is compared', async () => {
    const arugula = { id: 5, crop: { key: 'arugula', name: 'Arugula', season: 'cool' }, name: 'Peppertooth' } as unknown as VarietyDto;
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'viewer' })]),
      http.get('/api/gardens/1/varieties', () => HttpResponse.json({ items: [arugula, variety(1, 'Copperleaf Butterhead'), variety(2, 'Emberproof Cos')], page: 1, pageSize: 200, total: 3 })),
      http.get('/api/gardens/1/compare', () => HttpResponse.json(aComparison())),
    );
    renderApp('/g/1/compare?crop=arugula');
    expect(((await screen.findByRole('combobox', { name: 'Crop' }, { timeout: CLIENT_WAIT_MS })) as HTMLSelectElement).value).toBe('arugula');
    await waitFor(() => expect(seen.filter((r) => r.path === '/api/gardens/1/compare').at(-1)!.query.get('crop')).toBe('arugula'));
  });
});
