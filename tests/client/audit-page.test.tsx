// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { AuditEntryDto, AuditPageDto } from '#shared/schemas/audit';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const owner = { id: 3, email: 'ivo@example.org', name: 'Ivo Brandt' };

const sowingChange: AuditEntryDto = {
  id: 12,
  // 13:05 UTC is 09:05 in the garden's New York time.
  at: '2025-06-02T13:05:00.000Z',
  actor: { id: grower.id, name: grower.name },
  entity: 'planting',
  entityId: '5',
  action: 'changed',
  summary: 'Changed the sowing date of Copperleaf Butterhead in North 2',
  changes: [{ field: 'sownOn', label: 'sowing date', from: '2025-04-02', to: '2025-04-05' }],
};
const stationImport: AuditEntryDto = {
  id: 11,
  at: '2025-06-01T10:00:00.000Z',
  actor: { id: owner.id, name: owner.name },
  entity: 'weather-import',
  entityId: '4',
  action: 'imported',
  summary: 'Imported 120 days of station weather, 1 Feb – 31 May',
  changes: [
    { field: 'file', label: 'file', to: 'station.csv' },
    { field: 'daysAdded', label: 'days added', to: 120 },
  ],
};

function page(items: AuditEntryDto[], over: Partial<AuditPageDto> = {}): AuditPageDto {
  return { items, page: 1, pageSize: 50, total: items.length, actors: [{ id: owner.id, name: owner.name }, { id: grower.id, name: grower.name }], ...over };
}

describe('Audit page', () => {
  it('when an owner opens it, then each change shows when, who, what and its fields from → to', async () => {
    server.use(http.get('/api/gardens/1/audit', () => HttpResponse.json(page([sowingChange, stationImport]))), signedInAs(owner), ...memberOf([aGarden()]));
    renderApp('/g/1/audit');

    expect(await screen.findByText('Changed the sowing date of Copperleaf Butterhead in North 2')).toBeTruthy();
    const rows = screen.getAllByRole('row').slice(1);
    expect(rows).toHaveLength(2);
    const first = within(rows[0]);
    expect(first.getByText(/2 Jun 2025, 9:05/)).toBeTruthy();
    expect(first.getByText(grower.name)).toBeTruthy();
    expect(first.getByRole('list', { name: 'Fields changed' }).textContent).toBe('sowing date: 2 Apr 2025 → 5 Apr 2025');
    const second = within(rows[1]);
    expect(second.getByText(/Imported 120 days of station weather/)).toBeTruthy();
    expect(second.getByRole('list', { name: 'Fields changed' }).textContent).toBe('file: station.csvdays added: 120');
    expect(screen.getByText('2 changes')).toBeTruthy();
  });

  it('when the owner picks a record type and a member, then the trail is asked for with them and the address keeps them', async () => {
    server.use(http.get('/api/gardens/1/audit', () => HttpResponse.json(page([sowingChange]))), signedInAs(owner), ...memberOf([aGarden()]));
    const { user, router } = renderApp('/g/1/audit');
    await screen.findByText('Changed the sowing date of Copperleaf Butterhead in North 2');

    await user.selectOptions(screen.getByRole('combobox', { name: 'Record type' }), 'planting');
    await user.selectOptions(screen.getByRole('combobox', { name: 'Member' }), grower.name);

    await waitFor(() => expect(router.state.location.search).toBe(`?entity=planting&actor=${grower.id}`));
    await waitFor(() => expect(seen.some((r) => r.path === '/api/gardens/1/audit' && r.query.toString() === `entity=planting&actor=${grower.id}`)).toBe(true));
  });

  it('when there are more changes than a page, then Older asks for the next page', async () => {
    server.use(
      http.get('/api/gardens/1/audit', ({ request }) => {
        const p = Number(new URL(request.url).searchParams.get('page') ?? 1);
        return HttpResponse.json(page(p === 1 ? [sowingChange] : [stationImport], { page: p, pageSize: 1, total: 2 }));
      }),
      signedInAs(owner),
      ...memberOf([aGarden()]),
    );
    const { user, router } = renderApp('/g/1/audit');
    expect(await screen.findByText('Changes 1–1 of 2')).toBeTruthy();
    expect((screen.getByRole('button', { name: 'Newer' }) as HTMLButtonElement).disabled).toBe(true);
    await user.click(screen.getByRole('button', { name: 'Older' }));
    expect(await screen.findByText(/Imported 120 days/)).toBeTruthy();
    expect(router.state.location.search).toBe('?page=2');
    expect(screen.getByText('Changes 2–2 of 2')).toBeTruthy();
  });

  it('when nothing has changed yet, then it says so; when the trail fails to load, then it says so and offers Try again', async () => {
    server.use(http.get('/api/gardens/1/audit', () => HttpResponse.json(page([], { actors: [] }))), signedInAs(owner), ...memberOf([aGarden()]));
    const view = renderApp('/g/1/audit');
    expect(await screen.findByText(/^No changes yet\./)).toBeTruthy();
    view.unmount();

    server.use(http.get('/api/gardens/1/audit', () => HttpResponse.json({ error: { code: 'internal', message: 'Something went wrong on our side.' } }, { status: 500 })));
    renderApp('/g/1/audit');
    expect(await screen.findByText('The changes could not be loaded — try again')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  });

  it('when a grower opens it, then the trail is not asked for and the page says it is for owners', async () => {
    server.use(signedInAs(grower), ...memberOf([aGarden({ role: 'grower' })]));
    renderApp('/g/1/audit');
    expect(await screen.findByText('Only an owner of this garden can read its audit trail.')).toBeTruthy();
    expect(seen.some((r) => r.path === '/api/gardens/1/audit')).toBe(false);
  });
});
