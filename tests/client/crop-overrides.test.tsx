// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { CropDto } from '#shared/schemas/crops';
import type { Role } from '#shared/schemas/gardens';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aCrop, aGarden, aParam, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

const upper = aParam({ key: 'upperC', label: 'Upper threshold', value: 23.9, source: 'Field trial summary (invented for tests)', confidence: 'L' });
const shared = aCrop([aParam(), upper]);
const overridden = aCrop([
  aParam({
    value: 5,
    origin: 'garden',
    confidence: null,
    source: 'Set for this garden: our own trials, 3 seasons',
    libraryDefault: { value: 4.4, source: 'Extension bulletin (invented for tests)', confidence: 'M' },
    updatedAt: '2025-04-20T10:00:00.000Z',
  }),
  upper,
]);

/** The library answers with whatever `current()` holds, so a PATCH handler can change it. */
function cropsPage(role: Role, current: () => CropDto) {
  return [signedInAs(grower), ...memberOf([aGarden({ role })]), http.get('/api/gardens/1/crops', () => HttpResponse.json({ crops: [current()] }))];
}

describe('crop overrides', () => {
  it('when the owner sets a base temperature in °F, then the PATCH carries °C and the row says it is overridden, beside the shared default', async () => {
    let crop = shared;
    server.use(
      ...cropsPage('owner', () => crop),
      http.patch('/api/gardens/1/crops/lettuce', () => {
        crop = overridden;
        return HttpResponse.json({ crop });
      }),
    );
    const { user } = renderApp('/g/1/crops');

    await user.click(await screen.findByText('Lettuce'));
    await user.click(screen.getByRole('button', { name: 'Set Base temperature for this garden' }));
    const form = screen.getByRole('form', { name: 'Set Base temperature for this garden' });
    const value = within(form).getByLabelText('Value for this garden, °F');
    expect((value as HTMLInputElement).value).toBe('39.9');
    await user.clear(value);
    await user.type(value, '200');
    await user.click(within(form).getByRole('button', { name: 'Save for this garden' }));
    expect(await within(form).findByText('Base temperature must be from 23 to 77 °F.')).toBeTruthy();
    expect(seen.filter((r) => r.method === 'PATCH')).toHaveLength(0);

    await user.clear(value);
    await user.type(value, '41');
    await user.type(within(form).getByLabelText('Why (optional)'), 'our own trials, 3 seasons');
    await user.click(within(form).getByRole('button', { name: 'Save for this garden' }));

    expect(await screen.findByText('Overridden for this garden')).toBeTruthy();
    const patch = seen.find((r) => r.method === 'PATCH')!;
    expect(patch.body).toEqual({ params: { baseC: { value: 5, note: 'our own trials, 3 seasons' } } });
    expect(screen.getByText(/Shared default:/).parentElement!.textContent).toContain('Shared default: 39.9 °F · Extension bulletin (invented for tests) · Medium confidence');
    expect(screen.getByRole('button', { name: 'Use the shared default for Base temperature' })).toBeTruthy();
  });

  it('when the owner goes back to the shared default, then the PATCH clears the override with null', async () => {
    let crop = overridden;
    server.use(
      ...cropsPage('owner', () => crop),
      http.patch('/api/gardens/1/crops/lettuce', () => {
        crop = shared;
        return HttpResponse.json({ crop });
      }),
    );
    const { user } = renderApp('/g/1/crops');

    await user.click(await screen.findByText('Lettuce'));
    await user.click(screen.getByRole('button', { name: 'Use the shared default for Base temperature' }));

    await waitFor(() => expect(screen.queryByText('Overridden for this garden')).toBeNull());
    expect(seen.find((r) => r.method === 'PATCH')!.body).toEqual({ params: { baseC: null } });
  });

  it('when a grower opens the library, then the garden’s value and its marker show but nothing can be changed', async () => {
    server.use(...cropsPage('grower', () => overridden));
    const { user } = renderApp('/g/1/crops');

    await user.click(await screen.findByText('Lettuce'));

    expect(screen.getByText('Overridden for this garden')).toBeTruthy();
    expect(screen.getByText('41 °F')).toBeTruthy();
    expect(screen.getByText('Only the garden’s owner can set this garden’s own values.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: /for this garden|shared default/ })).toBeNull();
  });
});

describe('crop values checked together', () => {
  it('when the owner sets a base above the upper threshold, then the form says so in °F and sends nothing', async () => {
    server.use(...cropsPage('owner', () => shared));
    const { user } = renderApp('/g/1/crops');

    await user.click(await screen.findByText('Lettuce'));
    await user.click(screen.getByRole('button', { name: 'Set Base temperature for this garden' }));
    const form = screen.getByRole('form', { name: 'Set Base temperature for this garden' });
    const value = within(form).getByLabelText('Value for this garden, °F');
    await user.clear(value);
    await user.type(value, '77');
    await user.click(within(form).getByRole('button', { name: 'Save for this garden' }));

    expect(await within(form).findByText('The upper threshold (75 °F) must be above the base temperature (77 °F).')).toBeTruthy();
    expect(seen.filter((r) => r.method === 'PATCH')).toHaveLength(0);
  });

  it('when the server refuses the pair, then its message for this field shows under the field', async () => {
    const message = 'The upper threshold (80 °F) must be above the base temperature (82 °F).';
    server.use(
      ...cropsPage('owner', () => shared),
      http.patch('/api/gardens/1/crops/lettuce', () =>
        HttpResponse.json(
          { error: { code: 'validation_failed', message, fields: { 'params.baseC.value': message, 'params.upperC.value': message }, requestId: 'r1' } },
          { status: 400 },
        ),
      ),
    );
    const { user } = renderApp('/g/1/crops');

    await user.click(await screen.findByText('Lettuce'));
    await user.click(screen.getByRole('button', { name: 'Set Upper threshold for this garden' }));
    const form = screen.getByRole('form', { name: 'Set Upper threshold for this garden' });
    const value = within(form).getByLabelText('Value for this garden, °F');
    await user.clear(value);
    await user.type(value, '80');
    await user.click(within(form).getByRole('button', { name: 'Save for this garden' }));

    expect(await within(form).findByText(message)).toBeTruthy();
    expect(within(form).getByLabelText('Value for this garden, °F').getAttribute('aria-invalid')).toBe('true');
  });

  it('when a degree-day figure is the garden’s own, then the method it was counted with shows beside it, and a stale one says it is not used', async () => {
    const juvenile = (stale: boolean) =>
      aParam({
        key: 'juvenileGdd',
        label: 'Vernalization: juvenile phase before cold counts',
        group: 'Bolting',
        unit: 'C-days',
        value: 400,
        origin: 'garden',
        confidence: null,
        source: 'Set for this garden',
        libraryDefault: { value: 500, source: 'Extension bulletin (invented for tests)', confidence: 'L' },
        ddBasis: { baseC: 40 / 9, upperC: null, method: 'single-sine', cutoff: 'horizontal', stale },
      });
    let crop = aCrop([aParam(), upper, juvenile(false)]);
    server.use(...cropsPage('owner', () => crop));
    const first = renderApp('/g/1/crops');
    await first.user.click(await screen.findByText('Lettuce'));
    expect(screen.getByText('set at base 40 °F, single sine')).toBeTruthy();
    first.unmount();

    crop = aCrop([aParam(), upper, juvenile(true)]);
    const second = renderApp('/g/1/crops');
    await second.user.click(await screen.findByText('Lettuce'));
    expect(screen.getByText('Set at base 40 °F, single sine; this crop now counts differently, so it is not used until it is set again.')).toBeTruthy();
  });
});
