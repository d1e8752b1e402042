// @vitest-environment jsdom
import { describe, expect, it, vi } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { http, HttpResponse } from 'msw';
import type { Role } from '#shared/schemas/gardens';
import { PlantingForm } from '@/features/plantings/components/planting-form';
import type { PlantingChoices } from '@/features/plantings/components/planting-form';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aBed, aGarden, aPlanting, aProgress, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

// Invented beds and varieties, in the spirit of the demo garden.
const choices: PlantingChoices = {
  beds: [{ id: 3, name: 'North 1' }, { id: 4, name: 'North 2' }],
  varieties: [{ id: 7, name: 'Copperleaf Butterhead', cropName: 'Lettuce' }],
  seedLots: [{ id: 11, varietyId: 7, label: 'Lot HC-01001' }],
};

function renderEdit(onSaved = vi.fn()) {
  const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  const user = userEvent.setup();
  render(
    <QueryClientProvider client={queryClient}>
      <PlantingForm gardenId={1} choices={choices} today="2025-04-20" planting={aPlanting()} onSaved={onSaved} />
    </QueryClientProvider>,
  );
  return { user, onSaved };
}

const page = (total: number, items: unknown[]) => ({ items, page: 1, pageSize: 200, total });

function plantingPage(role: Role) {
  return [
    signedInAs(grower),
    ...memberOf([aGarden({ role })]),
    http.get('/api/gardens/1/plantings/5', () => HttpResponse.json({ planting: aPlanting() })),
    http.get('/api/gardens/1/plantings/5/progress', () => HttpResponse.json(aProgress())),
    http.get('/api/gardens/1/plantings/5/log', () => HttpResponse.json(page(0, []))),
    http.get('/api/gardens/1/plantings/5/photos', () =>
      HttpResponse.json({ photos: [{ id: 2, plantingId: 5, takenOn: '2025-04-12', caption: 'Rows up', width: 4, height: 3, bytes: 900, url: '/api/gardens/1/plantings/5/photos/2', by: 'Mara Quill' }] }),
    ),
    // The photo itself; jsdom asks for it when the <img> is rendered.
    http.get('/api/gardens/1/plantings/5/photos/2', () => new HttpResponse(null, { status: 204 })),
  ];
}

describe('editing a planting', () => {
  it('when a grower edits, then the form starts from the planting and the PATCH carries only the changed fields', async () => {
    server.use(http.patch('/api/gardens/1/plantings/5', () => HttpResponse.json({ planting: aPlanting({ quantity: 30, bed: { id: 4, name: 'North 2' } }) })));
    const { user, onSaved } = renderEdit();

    expect((screen.getByRole('combobox', { name: 'Bed' }) as HTMLSelectElement).value).toBe('3');
    expect((screen.getByRole('combobox', { name: 'Seed lot (optional)' }) as HTMLSelectElement).value).toBe('11');
    expect((screen.getByLabelText('Sown on') as HTMLInputElement).value).toBe('2025-04-02');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Bed' }), '4');
    await user.clear(screen.getByLabelText('Quantity'));
    await user.type(screen.getByLabelText('Quantity'), '30');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));

    await waitFor(() => expect(onSaved).toHaveBeenCalled());
    expect(seen).toHaveLength(1);
    expect(seen[0].method).toBe('PATCH');
    expect(seen[0].path).toBe('/api/gardens/1/plantings/5');
    expect(seen[0].body).toEqual({ bedId: 4, quantity: 30 });
  });

  it('when a change breaks the planting, then nothing is sent and the field says why', async () => {
    const { user } = renderEdit();

    await user.selectOptions(screen.getByRole('combobox', { name: 'Status' }), 'bolted');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(await screen.findByText('A bolted planting needs the date it bolted.')).toBeTruthy();
    expect(seen).toHaveLength(0);
  });

  it('when the server refuses a field, then its message lands under that field', async () => {
    server.use(
      http.patch('/api/gardens/1/plantings/5', () =>
        HttpResponse.json(
          { error: { code: 'validation_failed', message: 'Please check the fields: sownOn.', fields: { sownOn: 'Sowing date is out of range.' } } },
          { status: 400 },
        ),
      ),
    );
    const { user, onSaved } = renderEdit();

    await user.clear(screen.getByLabelText('Sown on'));
    await user.type(screen.getByLabelText('Sown on'), '2025-04-03');
    await user.click(screen.getByRole('button', { name: 'Save changes' }));

    expect(await screen.findByText('Sowing date is out of range.')).toBeTruthy();
    expect(screen.getByLabelText('Sown on').getAttribute('aria-invalid')).toBe('true');
    expect(seen[0].body).toEqual({ sownOn: '2025-04-03' });
    expect(onSaved).not.toHaveBeenCalled();
  });
});

describe('deleting', () => {
  it('when a grower deletes a planting, then it first says what will be lost, and only the confirmation sends the DELETE', async () => {
    server.use(
      ...plantingPage('grower'),
      http.delete('/api/gardens/1/plantings/5', () => new HttpResponse(null, { status: 204 })),
      http.get('/api/gardens/1/plantings', () => HttpResponse.json(page(0, []))),
    );
    const { user, router } = renderApp('/g/1/plantings/5');

    await user.click(await screen.findByRole('button', { name: 'Delete planting Lettuce: Copperleaf Butterhead' }));
    const ask = screen.getByRole('group', { name: 'Delete this planting of Copperleaf Butterhead in North 1?' });
    await waitFor(() => expect(within(ask).getByText(/14 log entries and 1 photo are deleted with it/)).toBeTruthy());
    expect(seen.filter((r) => r.method === 'DELETE')).toHaveLength(0);

    await user.click(within(ask).getByRole('button', { name: 'Delete planting' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/g/1/plantings'));
    expect(seen.filter((r) => r.method === 'DELETE').map((r) => r.path)).toEqual(['/api/gardens/1/plantings/5']);
  });

  it('when “Keep it” is chosen, then nothing is deleted', async () => {
    server.use(...plantingPage('grower'));
    const { user } = renderApp('/g/1/plantings/5');

    await user.click(await screen.findByRole('button', { name: 'Delete planting Lettuce: Copperleaf Butterhead' }));
    await user.click(screen.getByRole('button', { name: 'Keep it' }));

    expect(screen.getByRole('button', { name: 'Delete planting Lettuce: Copperleaf Butterhead' })).toBeTruthy();
    expect(seen.filter((r) => r.method === 'DELETE')).toHaveLength(0);
  });

  it('when a bed has plantings on record, then it offers no delete and says why', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'grower' })]),
      http.get('/api/gardens/1/beds', () => HttpResponse.json(page(1, [aBed({ plantingsOnRecord: 4 })]))),
    );
    renderApp('/g/1/beds');

    expect(await screen.findByText('Can’t be deleted: 4 plantings on record grew here, and their history keeps the bed.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Delete bed North 1' })).toBeNull();
  });

  it('when a planting lands in a bed just before it is deleted, then the 409 is explained in words and the bed stays', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'grower' })]),
      http.get('/api/gardens/1/beds', () => HttpResponse.json(page(1, [aBed({ plantingsOnRecord: 0 })]))),
      http.delete('/api/gardens/1/beds/3', () =>
        HttpResponse.json({ error: { code: 'in_use', message: 'This bed has 6 plantings on record; move or delete them first.' } }, { status: 409 }),
      ),
    );
    const { user } = renderApp('/g/1/beds');

    await user.click(await screen.findByRole('button', { name: 'Delete bed North 1' }));
    expect(screen.getByText('Its name, size and notes are removed for good.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Delete bed' }));

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Still in use, so not deleted')).toBeTruthy();
    expect(within(alert).getByText('This bed has 6 plantings on record; move or delete them first.')).toBeTruthy();
    expect(screen.getByRole('heading', { name: 'North 1' })).toBeTruthy();
  });
});

describe('viewers', () => {
  it('when a viewer opens a planting, then there is no edit, delete, quick log or photo upload', async () => {
    server.use(...plantingPage('viewer'));
    renderApp('/g/1/plantings/5');

    expect(await screen.findByRole('heading', { name: 'Lettuce: Copperleaf Butterhead' })).toBeTruthy();
    expect(await screen.findByText('Rows up', { exact: false })).toBeTruthy();
    expect(screen.queryByRole('button', { name: /Edit planting/ })).toBeNull();
    expect(screen.queryByRole('button', { name: /^Delete/ })).toBeNull();
    expect(screen.queryByRole('heading', { name: 'Add to the log' })).toBeNull();
    expect(screen.queryByLabelText('Photo')).toBeNull();
  });

  it('when a viewer opens Beds, then each bed shows without edit or delete', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'viewer' })]),
      http.get('/api/gardens/1/beds', () => HttpResponse.json(page(1, [aBed()]))),
    );
    renderApp('/g/1/beds');

    expect(await screen.findByRole('heading', { name: 'North 1' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Edit bed North 1' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Delete bed North 1' })).toBeNull();
  });
});
