// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { ClimateDto } from '#shared/schemas/climate';
import { seen, server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aClimate, aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

const fromHistory: ClimateDto = aClimate({
  years: 6,
  estimate: true,
  reason: null,
  lastSpringFrost: { p10: '04-02', p50: '04-17', p90: '05-03', years: 6, estimate: true },
  firstFallFrost: { p10: '09-30', p50: '10-11', p90: '10-25', years: 6, estimate: true },
  frostFreeDays: { p10: 154, p50: 177, p90: 200, years: 6, estimate: true },
  extremeMinimum: { mean: -4, unit: 'F', years: 6, estimate: true },
  zone: { zone: '6b', years: 6, estimate: true },
});

function climateIs(climate: ClimateDto) {
  return http.get('/api/gardens/:gardenId/climate', () => HttpResponse.json({ climate }));
}

function fact(term: string) {
  const dt = screen.getByText(term, { selector: 'dt' });
  return dt.nextElementSibling as HTMLElement;
}

describe('“Climate here” on the garden settings page', () => {
  it('when a viewer opens settings, then the frost dates, season, winter low and zone read in words with their years, flagged as an estimate, and no form', async () => {
    server.use(signedInAs(grower), climateIs(fromHistory), ...memberOf([aGarden({ role: 'viewer' })]));
    renderApp('/g/1/settings');
    const section = await screen.findByRole('region', { name: 'Climate here' });
    expect(await within(section).findByText(/Only 6 years of weather/)).toBeTruthy();
    expect(fact('Last spring frost').textContent).toContain('Half of seasons by 17 Apr; 1 in 10 by 2 Apr; 9 in 10 by 3 May.');
    expect(fact('Last spring frost').textContent).toContain('from 6 seasons of this garden’s weather (an estimate)');
    expect(fact('First fall frost').textContent).toContain('Half of seasons by 11 Oct');
    expect(fact('Frost-free season').textContent).toContain('177 days in a middling season; 154 in a short one (1 in 10), 200 in a long one (9 in 10).');
    expect(fact('Coldest night of winter, on average').textContent).toContain('−4.0 °F');
    expect(fact('Hardiness zone').textContent).toContain('6b');
    expect(fact('Hardiness zone').textContent).toContain('from 6 winters');
    expect(within(section).queryByRole('textbox')).toBeNull();
  });

  it('when the owner sets a last frost and a zone, then they are sent as month-day and zone, and shown beside the history', async () => {
    let climate = fromHistory;
    server.use(
      signedInAs(grower),
      // Before memberOf's own climate answer: the first matching handler answers.
      http.get('/api/gardens/:gardenId/climate', () => HttpResponse.json({ climate })),
      http.put('/api/gardens/:gardenId/climate', async ({ request }) => {
        const body = (await request.json()) as { lastSpringFrost50: string | null; firstFallFrost50: string | null; zone: string | null };
        const override = { ...body, updatedAt: '2026-05-01T10:00:00Z' };
        climate = { ...fromHistory, override, source: 'override' };
        return HttpResponse.json({ override });
      }),
      ...memberOf([aGarden({ role: 'owner' })]),
    );
    const { user } = renderApp('/g/1/settings');
    const section = await screen.findByRole('region', { name: 'Climate here' });
    await user.type(await within(section).findByLabelText('Last spring frost'), '05-01');
    await user.type(within(section).getByLabelText('Hardiness zone'), '6a');
    await user.click(within(section).getByRole('button', { name: 'Save climate figures' }));
    expect(await within(section).findByText('Climate figures saved.')).toBeTruthy();
    expect(seen.find((r) => r.method === 'PUT')?.body).toEqual({ lastSpringFrost50: '05-01', firstFallFrost50: null, zone: '6a' });
    expect(await within(section).findByText('Your setting: about 1 May.')).toBeTruthy();
    expect(within(section).getByText('Your setting: 6a.')).toBeTruthy();
  });

  it('when the owner types a day that does not exist, then the field says so and nothing is sent', async () => {
    server.use(signedInAs(grower), climateIs(fromHistory), ...memberOf([aGarden({ role: 'owner' })]));
    const { user } = renderApp('/g/1/settings');
    const section = await screen.findByRole('region', { name: 'Climate here' });
    const input = await within(section).findByLabelText('First fall frost');
    await user.type(input, '09-31');
    await user.click(within(section).getByRole('button', { name: 'Save climate figures' }));
    expect(await within(section).findByText('First fall frost must be a month and day, MM-DD (e.g. 04-25).')).toBeTruthy();
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(seen.some((r) => r.method === 'PUT')).toBe(false);
  });

  it('when the garden has no weather yet, then the section says why instead of figures', async () => {
    server.use(signedInAs(grower), ...memberOf([aGarden({ role: 'viewer' })]));
    renderApp('/g/1/settings');
    const section = await screen.findByRole('region', { name: 'Climate here' });
    expect(await within(section).findByText('No weather is stored for this garden yet.')).toBeTruthy();
    expect(fact('Hardiness zone').textContent).toContain('Not known yet.');
  });
});
