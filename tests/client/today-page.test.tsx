// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { TodayDto } from '#shared/schemas/progress';
import { server, setupClientTests, useBrowserLanguages } from './helpers/msw-server';
import { aGarden, aToday, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();
useBrowserLanguages(['en-GB']);

function gardenToday(today: TodayDto, garden = aGarden()) {
  return [signedInAs(grower), ...memberOf([garden]), http.get('/api/gardens/1/today', () => HttpResponse.json(today))];
}

const section = (name: string) => screen.getByRole('region', { name });

describe('Today', () => {
  it('when something needs attention, then bolt-high comes before an open window, each with its kind in words, figures, advice and planting', async () => {
    server.use(...gardenToday(aToday()));
    renderApp('/g/1');

    const attention = await screen.findByRole('region', { name: 'Needs attention' });
    const items = within(attention).getAllByRole('listitem');
    expect(items).toHaveLength(2);
    expect(within(items[0]).getByText(/Bolt risk high/).textContent).toBe('Bolt risk high · 9 Jun');
    expect(within(items[0]).getByRole('heading', { name: 'Lettuce: Copperleaf Butterhead may bolt' })).toBeTruthy();
    expect(within(items[0]).getByText('Highs of 84–88 °F for 4 days from 9 Jun')).toBeTruthy();
    expect(within(items[0]).getByText('Harvest early or shade the bed; keep it watered.')).toBeTruthy();
    expect(within(items[0]).getByRole('link', { name: 'Open Lettuce: Copperleaf Butterhead' }).getAttribute('href')).toBe('/g/1/plantings/5');
    expect(within(items[1]).getByText(/Harvest window open/)).toBeTruthy();
    expect(within(items[1]).getByRole('link', { name: 'Open Radish: Ember Globe' }).getAttribute('href')).toBe('/g/1/plantings/9');
    const order = ['Needs attention', 'Growing now', 'Weather', 'About this garden'];
    const headings = screen.getAllByRole('heading', { level: 2 }).map((h) => h.textContent);
    expect(headings).toEqual(order);
  });

  it('when plantings are growing, then each has its progress bar with figures, ready window and bolt risk in words', async () => {
    server.use(...gardenToday(aToday()));
    renderApp('/g/1');

    const growing = await screen.findByRole('region', { name: 'Growing now' });
    const lettuce = within(growing).getByRole('progressbar', { name: 'Heat toward maturity of Lettuce: Copperleaf Butterhead' });
    expect(lettuce.getAttribute('aria-valuenow')).toBe('43');
    expect(lettuce.getAttribute('aria-valuemax')).toBe('100');
    expect(lettuce.getAttribute('aria-valuetext')).toBe('43 % · 412 of 950 °F-days');
    expect(within(growing).getByText('43 % · 412 of 950 °F-days')).toBeTruthy();
    expect(within(growing).getByText('Likely ready 14–22 Jun')).toBeTruthy();
    expect(within(growing).getByText('Bolt risk: Elevated, high from 9 Jun')).toBeTruthy();
    expect(within(growing).getByText('North 1')).toBeTruthy();
    const radish = within(growing).getByRole('progressbar', { name: 'Heat toward maturity of Radish: Ember Globe' });
    expect(radish.getAttribute('aria-valuenow')).toBe('100');
    expect(within(growing).getByText('103 % · 402 of 390 °F-days')).toBeTruthy();
    expect(within(growing).getByText('Target reached 31 May')).toBeTruthy();
    expect(within(growing).getByText('Bolt risk: Low')).toBeTruthy();
  });

  it('when more grow and more alerts are open than Today lists, then it says how many of how many, with the way to the rest', async () => {
    server.use(...gardenToday(aToday({ growingTotal: 5000, actionsTotal: 212 })));
    renderApp('/g/1');

    const growing = await screen.findByRole('region', { name: 'Growing now' });
    expect(within(growing).getByText(/The 2 that need you soonest \(highest bolt risk first, then the nearest harvest\) of 5,000 growing plantings/)).toBeTruthy();
    expect(within(growing).getByRole('link', { name: 'See every planting' }).getAttribute('href')).toBe('/g/1/plantings');
    const attention = section('Needs attention');
    expect(within(attention).getByText('The 2 most severe of 212 open alerts; the rest are on the alerts page.')).toBeTruthy();
  });

  it('when every growing planting is listed, then no count of the rest is shown', async () => {
    server.use(...gardenToday(aToday()));
    renderApp('/g/1');
    const growing = await screen.findByRole('region', { name: 'Growing now' });
    expect(within(growing).queryByText(/need you soonest/)).toBeNull();
    expect(screen.queryByText(/most severe of/)).toBeNull();
  });

  it('when the fortnight is shown, then each day has its high and low with units, forecast days say so and today is marked', async () => {
    server.use(...gardenToday(aToday()));
    renderApp('/g/1');

    const strip = await screen.findByRole('region', { name: 'Highs and lows, last 7 and next 7 days' });
    const days = within(strip).getAllByRole('listitem');
    expect(days).toHaveLength(14);
    expect(days[0].textContent).toBe('Mon 26 MayHigh 70.0 °FLow 48.0 °Fobserved');
    expect(days[7].getAttribute('aria-current')).toBe('date');
    expect(within(days[7]).getByText('Today')).toBeTruthy();
    expect(within(days[7]).getByText('forecast')).toBeTruthy();
    expect(within(days[13]).getByText('High 83.0 °F')).toBeTruthy();
    expect(within(strip).getAllByText('forecast')).toHaveLength(7);
  });

  it('when nothing is growing and nothing needs attention, then each section says so in words', async () => {
    server.use(...gardenToday(aToday({ actions: [], plantings: [], weather: [] })));
    renderApp('/g/1');

    expect(await screen.findByText('Nothing needs attention today.')).toBeTruthy();
    expect(within(section('Growing now')).getByText(/No plantings are growing\./)).toBeTruthy();
    expect(within(section('Growing now')).getByRole('link', { name: 'see all plantings' }).getAttribute('href')).toBe('/g/1/plantings');
    expect(within(section('Weather')).getByText('No weather for these days yet.')).toBeTruthy();
  });

  it('when the garden has no location, then Today says so first and the garden’s facts stay at the foot', async () => {
    server.use(...gardenToday(aToday({ actions: [], plantings: [], weather: [] }), aGarden({ latitude: null, longitude: null })));
    renderApp('/g/1');

    expect(await screen.findByText('No location yet')).toBeTruthy();
    expect(within(section('About this garden')).getByText('Not set')).toBeTruthy();
  });

  it('when Today cannot be loaded, then it says so with a way to try again', async () => {
    let calls = 0;
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.get('/api/gardens/1/today', () =>
        ++calls === 1 ? HttpResponse.json({ error: { code: 'internal', message: 'Something broke.' } }, { status: 500 }) : HttpResponse.json(aToday()),
      ),
    );
    const { user } = renderApp('/g/1');

    expect(within(await screen.findByRole('alert')).getByText('Today could not be loaded — try again')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Try again' }));

    expect(await screen.findByRole('region', { name: 'Growing now' })).toBeTruthy();
  });
});
