// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aGarden, aPlanting, aProgress, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

describe('day-by-day degree days download', () => {
  it('when a planting’s progress is shown, then a link downloads its degree days as CSV', async () => {
    const base = '/api/gardens/1/plantings/5';
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get(base, () => HttpResponse.json({ planting: aPlanting({ id: 5 }) })),
      http.get(`${base}/progress`, () => HttpResponse.json(aProgress())),
      http.get(`${base}/log`, () => HttpResponse.json({ items: [], page: 1, pageSize: 200, total: 0 })),
      http.get(`${base}/photos`, () => HttpResponse.json({ photos: [] })),
    );
    renderApp('/g/1/plantings/5');
    const link = await screen.findByRole('link', { name: 'Download day-by-day degree days (CSV)' });
    expect(link.getAttribute('href')).toBe(`${base}/degree-days.csv`);
    expect(link.hasAttribute('download')).toBe(true);
  });
});
