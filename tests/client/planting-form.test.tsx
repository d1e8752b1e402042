// @vitest-environment jsdom
import { beforeEach, describe, expect, it, vi } from 'vitest';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { http, HttpResponse } from 'msw';
import { PlantingForm } from '@/features/plantings/components/planting-form';
import type { PlantingChoices } from '@/features/plantings/components/planting-form';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';

setupClientTests();
useBrowserLanguages(['en-GB']);

// The form also reads its harvest preview (GET); these tests are about what it writes.
const writes = () => seen.filter((r) => r.method !== 'GET');
const quietPreview = { unit: 'F', target: null, targetNote: '', startEvent: null, startReason: null, maturity: { p10: null, p50: null, p90: null, kind: 'none', note: 'No window yet.' }, boltSeason: null };
beforeEach(() => server.use(http.get('/api/gardens/1/plantings/preview', () => HttpResponse.json(quietPreview))));

// Invented beds and varieties, in the spirit of the demo garden.
const choices: PlantingChoices = {
  beds: [{ id: 3, name: 'North 1' }],
  varieties: [{ id: 7, name: 'Copperleaf Butterhead', cropName: 'Lettuce' }],
  seedLots: [{ id: 11, varietyId: 7, label: 'Lot HC-01001, packed for 2025' }],
};

function renderForm(onSaved = vi.fn(), given: PlantingChoices = choices) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const user = userEvent.setup();
  render(
    <QueryClientProvider client={queryClient}>
      <PlantingForm gardenId={1} choices={given} today="2025-04-02" onSaved={onSaved} />
    </QueryClientProvider>,
  );
  return { user, onSaved };
}

describe('planting form', () => {
  it('when a variety is chosen and the soil temperature is known, then what the soil means for its crop shows under it', async () => {
    const withSoil: PlantingChoices = {
      ...choices,
      varieties: [{ id: 7, name: 'Copperleaf Butterhead', cropName: 'Lettuce', cropKey: 'lettuce' }],
      soil: { now: 'Soil 48.2 °F today (your thermometer)', byCrop: { lettuce: 'Lettuce: Slow but sowable: comes up in about 6 days.' } },
    };
    const { user } = renderForm(vi.fn(), withSoil);
    expect(screen.queryByText(/Soil 48\.2 °F/)).toBeNull();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Variety' }), '7');
    expect(screen.getByText('Soil 48.2 °F today (your thermometer). Lettuce: Slow but sowable: comes up in about 6 days.')).toBeTruthy();
  });

  it('when saved without a bed or variety, then each field says what is missing and nothing is sent', async () => {
    const { user } = renderForm();
    await user.type(screen.getByLabelText('Quantity'), 'lots');
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    expect(await screen.findByText('Bed must be chosen.')).toBeDefined();
    expect(screen.getByText('Quantity must be a number.')).toBeDefined();
    expect(screen.getByText('Variety must be chosen.')).toBeDefined();
    expect(screen.getByRole('combobox', { name: 'Bed' }).getAttribute('aria-invalid')).toBe('true');
    expect(writes()).toHaveLength(0);
  });

  it('when dates run backwards or a status lacks its date, then the words say which and why', async () => {
    const { user } = renderForm();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Bed' }), '3');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Variety' }), '7');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Status' }), 'bolted');
    await user.click(screen.getByText('More dates (emerged, harvested, bolted…)'));
    await user.type(screen.getByLabelText('Emerged'), '2025-03-01');
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    expect(await screen.findByText('Emergence cannot come before sowing.')).toBeDefined();
    expect(screen.getByText('A bolted planting needs the date it bolted.')).toBeDefined();
    expect(writes()).toHaveLength(0);
  });

  it('when the form is valid, then it posts the shared schema’s shape; a server field error lands under its field', async () => {
    server.use(
      http.post('/api/gardens/1/plantings', () =>
        HttpResponse.json(
          { error: { code: 'validation_failed', message: 'Please check the fields: seedLotId.', fields: { seedLotId: 'No such seed lot in this garden.' } } },
          { status: 400 },
        ),
      ),
    );
    const { user, onSaved } = renderForm();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Bed' }), '3');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Variety' }), '7');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Seed lot (optional)' }), '11');
    await user.type(screen.getByLabelText('Quantity'), '24');
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    expect(await screen.findByText('No such seed lot in this garden.')).toBeDefined();
    await waitFor(() => expect(writes()).toHaveLength(1));
    expect(writes()[0].headers.get('x-requested-with')).toBe('heatclock');
    expect(writes()[0].body).toMatchObject({ bedId: 3, varietyId: 7, seedLotId: 11, method: 'direct-sow', status: 'growing', quantity: 24, sownOn: '2025-04-02', emergedOn: null });
    expect(onSaved).not.toHaveBeenCalled();
  });

  it('when no seed lot is chosen, or one is chosen and then cleared, then the planting saves without a lot and no lot error shows', async () => {
    server.use(http.post('/api/gardens/1/plantings', () => HttpResponse.json({ planting: { id: 1 } }, { status: 201 })));
    const { user, onSaved } = renderForm();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Bed' }), '3');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Variety' }), '7');
    const lot = screen.getByRole('combobox', { name: 'Seed lot (optional)' });
    await user.selectOptions(lot, '11');
    await user.selectOptions(lot, '');
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    await waitFor(() => expect(writes()).toHaveLength(1));
    expect(screen.queryByText('Seed lot must be chosen.')).toBeNull();
    expect(writes()[0].body).toMatchObject({ bedId: 3, varietyId: 7, seedLotId: null });
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
  });

  it('when a variety and a sowing date are chosen, then the expected harvest shows before saving, with a bolt warning in words', async () => {
    server.use(
      http.get('/api/gardens/1/plantings/preview', ({ request }) => {
        const q = new URL(request.url).searchParams;
        if (q.get('sownOn') !== '2025-05-10') return HttpResponse.json(quietPreview);
        expect(Object.fromEntries(q)).toEqual({ varietyId: '7', method: 'direct-sow', sownOn: '2025-05-10' });
        return HttpResponse.json({
          unit: 'F',
          target: 950,
          targetNote: '55 days from sowing, measured in this garden’s past weather.',
          startEvent: { kind: 'sowing', on: '2025-05-10' },
          startReason: null,
          maturity: { p10: '2025-06-28', p50: '2025-07-02', p90: '2025-07-08', kind: 'analog', note: '' },
          boltSeason: { highShare: 0.8, years: 5, warning: 'High bolt risk: Lettuce sown on 10 May would have met bolting heat or long days while ready to pick in 4 of the last 5 seasons here.' },
        });
      }),
    );
    const { user } = renderForm();
    expect(screen.getByText('Choose a variety and its sowing date to see when it is likely ready.')).toBeDefined();
    await user.selectOptions(screen.getByRole('combobox', { name: 'Variety' }), '7');
    const sown = screen.getByLabelText('Sown on');
    await user.clear(sown);
    await user.type(sown, '2025-05-10');
    expect(await screen.findByText('Likely ready 28 Jun – 8 Jul (middle estimate 2 Jul), from this garden’s past seasons.')).toBeDefined();
    expect(screen.getByText(/Target: 950 °F-days\./)).toBeDefined();
    expect(screen.getByText(/^High bolt risk: Lettuce sown on 10 May/)).toBeDefined();
    expect(writes()).toHaveLength(0);
  });
});
