// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { File as NodeFile } from 'node:buffer';
import { http, HttpResponse } from 'msw';
import type { Role } from '#shared/schemas/gardens';
import { seen, server, setupClientTests, useNodeFormData } from './helpers/msw-server';
import { aBed, aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

const page = (items: unknown[]) => ({ items, page: 1, pageSize: 200, total: items.length });

function plantingsPage(role: Role) {
  return [
    signedInAs(grower),
    ...memberOf([aGarden({ role })]),
    http.get('/api/gardens/1/plantings', () => HttpResponse.json(page([]))),
    http.get('/api/gardens/1/beds', () => HttpResponse.json(page([aBed()]))),
    http.get('/api/gardens/1/varieties', () => HttpResponse.json(page([]))),
  ];
}

const csv = () => new NodeFile(['bed,crop,variety,method,status\nSouth 9,lettuce,Copperleaf Butterhead,direct-sow,sprouting\n'], 'plantings.csv', { type: 'text/csv' }) as unknown as File;

describe('planting CSV import', () => {
  it('when the file has bad rows, then the 422 report lists each line and column and says nothing was imported', async () => {
    server.use(
      ...plantingsPage('grower'),
      http.post('/api/gardens/1/plantings/import', () =>
        HttpResponse.json(
          {
            error: {
              code: 'import_invalid',
              message: 'Nothing was imported: 2 problems in the file.',
              rows: [
                { line: 2, column: 'bed', message: 'No bed named "South 9" in this garden.' },
                { line: 2, column: 'status', message: 'Status must be planned, growing, harvested, bolted or failed.' },
              ],
            },
          },
          { status: 422 },
        ),
      ),
    );
    await useNodeFormData();
    const { user } = renderApp('/g/1/plantings');

    await user.click(await screen.findByRole('button', { name: 'Import CSV' }));
    expect(screen.getByRole('link', { name: 'Download an example file' }).getAttribute('download')).toBe('heatclock-plantings-example.csv');
    await user.upload(screen.getByLabelText('Plantings CSV file'), csv());
    await user.click(screen.getByRole('button', { name: 'Import plantings' }));

    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Nothing was imported')).toBeTruthy();
    const rows = within(within(alert).getByRole('table')).getAllByRole('row').slice(1).map((r) => r.textContent);
    expect(rows).toEqual(['2bedNo bed named "South 9" in this garden.', '2statusStatus must be planned, growing, harvested, bolted or failed.']);
    const upload = seen.find((r) => r.path === '/api/gardens/1/plantings/import')!;
    expect(upload.headers.get('x-requested-with')).toBe('heatclock');
    expect(((upload.body as FormData).get('file') as Blob & { name: string }).name).toBe('plantings.csv');
  });

  it('when the file is accepted, then the summary counts what was added, updated and already there', async () => {
    server.use(
      ...plantingsPage('owner'),
      http.post('/api/gardens/1/plantings/import', () =>
        HttpResponse.json({ report: { plantingsCreated: 3, plantingsUpdated: 1, plantingsUnchanged: 2, logEntriesCreated: 9, logEntriesExisting: 4 } }),
      ),
    );
    await useNodeFormData();
    const { user } = renderApp('/g/1/plantings');

    await user.click(await screen.findByRole('button', { name: 'Import CSV' }));
    await user.upload(screen.getByLabelText('Plantings CSV file'), csv());
    await user.click(screen.getByRole('button', { name: 'Import plantings' }));

    const done = await screen.findByText('Plantings imported');
    expect(done.parentElement!.textContent).toContain('Plantings: 3 added, 1 updated, 2 already up to date. Log entries: 9 added, 4 already in the log.');
  });

  it('when no file is chosen, then the form says so and nothing is sent', async () => {
    server.use(...plantingsPage('grower'));
    const { user } = renderApp('/g/1/plantings');

    await user.click(await screen.findByRole('button', { name: 'Import CSV' }));
    await user.click(screen.getByRole('button', { name: 'Import plantings' }));

    expect(await screen.findByText('Choose a CSV file to upload.')).toBeTruthy();
    expect(seen.filter((r) => r.method === 'POST')).toHaveLength(0);
  });

  it('when a viewer opens Plantings, then there is export but no import or new planting', async () => {
    server.use(...plantingsPage('viewer'));
    renderApp('/g/1/plantings');

    expect(await screen.findByRole('link', { name: 'Export CSV' })).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Import CSV' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'New planting' })).toBeNull();
  });
});
