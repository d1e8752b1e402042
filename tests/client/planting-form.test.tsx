// @vitest-environment jsdom
import { describe, expect, it, vi } from 'vitest';
import { render, screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { http, HttpResponse } from 'msw';
import { PlantingForm } from '@/features/plantings/components/planting-form';
import type { PlantingChoices } from '@/features/plantings/components/planting-form';
import { seen, server, setupClientTests } from './helpers/msw-server';

setupClientTests();

// Invented beds and varieties, in the spirit of the demo garden.
const choices: PlantingChoices = {
  beds: [{ id: 3, name: 'North 1' }],
  varieties: [{ id: 7, name: 'Copperleaf Butterhead', cropName: 'Lettuce' }],
  seedLots: [{ id: 11, varietyId: 7, label: 'Lot HC-01001, packed for 2025' }],
};

function renderForm(onSaved = vi.fn()) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const user = userEvent.setup();
  render(
    <QueryClientProvider client={queryClient}>
      <PlantingForm gardenId={1} choices={choices} today="2025-04-02" onSaved={onSaved} />
    </QueryClientProvider>,
  );
  return { user, onSaved };
}

describe('planting form', () => {
  it('when saved without a bed or variety, then each field says what is missing and nothing is sent', async () => {
    const { user } = renderForm();
    await user.type(screen.getByLabelText('Quantity'), 'lots');
    await user.click(screen.getByRole('button', { name: 'Save planting' }));
    expect(await screen.findByText('Bed must be chosen.')).toBeDefined();
    expect(screen.getByText('Quantity must be a number.')).toBeDefined();
    expect(screen.getByText('Variety must be chosen.')).toBeDefined();
    expect(screen.getByRole('combobox', { name: 'Bed' }).getAttribute('aria-invalid')).toBe('true');
    expect(seen).toHaveLength(0);
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
    expect(seen).toHaveLength(0);
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
    await waitFor(() => expect(seen).toHaveLength(1));
    expect(seen[0].headers.get('x-requested-with')).toBe('heatclock');
    expect(seen[0].body).toMatchObject({ bedId: 3, varietyId: 7, seedLotId: 11, method: 'direct-sow', status: 'growing', quantity: 24, sownOn: '2025-04-02', emergedOn: null });
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
    await waitFor(() => expect(seen).toHaveLength(1));
    expect(screen.queryByText('Seed lot must be chosen.')).toBeNull();
    expect(seen[0].body).toMatchObject({ bedId: 3, varietyId: 7, seedLotId: null });
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
  });
});
