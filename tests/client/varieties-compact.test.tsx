// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { VarietyDto } from '#shared/schemas/varieties';
import type { DisplayUnit } from '#shared/schemas/gardens';
import { traitGuidance } from '#shared/crops/guidance';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

// Invented varieties, in the spirit of the demo garden.
function aVariety(overrides: Partial<VarietyDto> = {}): VarietyDto {
  const traits = overrides.traits ?? ['f1-hybrid', 'treated'];
  return {
    id: 7,
    crop: { key: 'lettuce', name: 'Lettuce', season: 'cool' },
    name: 'Copperleaf Butterhead',
    dtmDays: 55,
    dtmFrom: 'sowing',
    emergenceDaysMin: 4,
    emergenceDaysMax: 8,
    boltTolerance: 4,
    heatTolerance: 2,
    traits,
    containerFriendly: false,
    sunHours: 6,
    waterCmPerWeek: 2.54,
    sowDepthCm: 1.27,
    spacingCm: 30.48,
    thinSpacingCm: null,
    gddTargetOverrideC: null,
    gddTargetBasis: null,
    notes: '',
    guidance: traitGuidance(traits),
    gddTarget: { valueC: 600, basis: 'derived', countsFrom: 'sowing', explanation: '55 days from sowing, measured in this garden’s past weather.', p10C: 560, p90C: 650, stale: false },
    ...overrides,
  };
}

const three = [
  aVariety(),
  aVariety({ id: 8, name: 'Ridgeline Romaine', spacingCm: 25.4 }),
  aVariety({ id: 9, name: 'Harrow Oakleaf', traits: ['f1-hybrid', 'treated', 'pelleted'], guidance: traitGuidance(['f1-hybrid', 'treated', 'pelleted']) }),
];

function varietiesPage(units: DisplayUnit, items: VarietyDto[] = three) {
  server.use(
    signedInAs(grower),
    ...memberOf([aGarden({ units, role: 'grower' })]),
    http.get('/api/gardens/1/varieties', () => HttpResponse.json({ items, page: 1, pageSize: 200, total: items.length })),
  );
  return renderApp('/g/1/varieties');
}

const occurrences = (text: string) => document.body.textContent.split(text).length - 1;

describe('compact variety cards', () => {
  it('when several varieties carry the same traits, then each trait’s guidance is said once on the page', async () => {
    varietiesPage('F');
    await screen.findByRole('heading', { name: 'Ridgeline Romaine' });
    const [f1, treated] = traitGuidance(['f1-hybrid', 'treated']);
    expect(occurrences(f1.text)).toBe(1);
    expect(occurrences(treated.text)).toBe(1);
    expect(occurrences(traitGuidance(['pelleted'])[0].text)).toBe(1);
    // Each card still carries its tags.
    const romaine = screen.getByRole('article', { name: 'Ridgeline Romaine' });
    expect(within(within(romaine).getByRole('list', { name: 'Traits' })).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      'F1 hybrid',
      'Treated (handle with care: see the trait notes at the top of the page)',
    ]);
  });

  it('when the page opens, then each card shows its degree-day target in the garden’s unit without another request', async () => {
    varietiesPage('F');
    const card = await screen.findByRole('article', { name: 'Copperleaf Butterhead' });
    // 600 °C-days are 1,080 °F-days.
    expect(within(card).getByText('Degree-day target: 1,080 °F-days from sowing')).toBeTruthy();
    expect(within(card).getByText(/Worked out from the packet’s 55 days/)).toBeTruthy();
    expect(within(card).getByText('55 days from sowing')).toBeTruthy();
    expect(card.textContent).toContain('Bolt tolerance good');
    expect(seen.filter((r) => /\/varieties\/\d+/.test(r.path))).toHaveLength(0);
  });

  it('when the garden reads °C, then the target is in °C-days and spacing in cm', async () => {
    varietiesPage('C');
    const card = await screen.findByRole('article', { name: 'Copperleaf Butterhead' });
    expect(within(card).getByText('Degree-day target: 600 °C-days from sowing')).toBeTruthy();
    expect(within(card).getByText('30.5 cm')).toBeTruthy();
  });

  it('when the garden reads °F, then spacing, depth and water read in inches', async () => {
    varietiesPage('F');
    const card = await screen.findByRole('article', { name: 'Copperleaf Butterhead' });
    expect(within(card).getByText('12 in')).toBeTruthy();
    expect(within(card).getByText('0.5 in')).toBeTruthy();
    expect(within(card).getByText('1 in a week')).toBeTruthy();
    expect(card.textContent).not.toMatch(/\bcm\b/);
  });

  it('when a °F grower types a spacing out of range, then the message is in inches and nothing is sent; in range, the API gets cm', async () => {
    server.use(http.patch('/api/gardens/1/varieties/7', async ({ request }) => HttpResponse.json({ variety: { ...aVariety(), ...((await request.json()) as object) } })));
    const { user } = varietiesPage('F');
    await user.click(await screen.findByRole('button', { name: 'Edit variety Copperleaf Butterhead' }));
    const form = screen.getByRole('form', { name: 'Edit variety Copperleaf Butterhead' });
    const spacing = within(form).getByLabelText('Spacing') as HTMLInputElement;
    expect(spacing.value).toBe('12');
    await user.clear(spacing);
    await user.type(spacing, '200');
    await user.click(within(form).getByRole('button', { name: 'Save changes' }));
    expect(await within(form).findByText('Spacing must be from 0.4 to 118.1 in.')).toBeTruthy();
    expect(seen.filter((r) => r.method === 'PATCH')).toHaveLength(0);

    await user.clear(spacing);
    await user.type(spacing, '10');
    await user.click(within(form).getByRole('button', { name: 'Save changes' }));
    await screen.findByRole('article', { name: 'Copperleaf Butterhead' });
    expect(seen.filter((r) => r.method === 'PATCH').map((r) => r.body)).toEqual([{ spacingCm: 25.4 }]);
  });
});

describe('calibrating from the garden’s harvests', () => {
  it('when the grower opens "From your harvests", then the median and its harvests show with a caution, and adopting sends the median in °C-days', async () => {
    let asked = 0;
    server.use(
      http.get('/api/gardens/1/varieties/7/calibration', () => {
        asked++;
        return HttpResponse.json({
          unit: 'F',
          count: 2,
          unmeasured: 0,
          median: 1008,
          medianC: 560,
          p25: 972,
          p75: 1044,
          min: 972,
          max: 1044,
          caution: 'Only 2 harvests back this figure: treat it as a first guess and keep recording.',
          harvests: [
            { plantingId: 5, startOn: '2025-04-02', firstHarvestOn: '2025-05-30', degreeDays: 1044, days: 58 },
            { plantingId: 6, startOn: '2025-08-10', firstHarvestOn: '2025-09-28', degreeDays: 972, days: 49 },
          ],
        });
      }),
      http.patch('/api/gardens/1/varieties/7', () => HttpResponse.json({ variety: aVariety({ gddTargetOverrideC: 560 }) })),
    );
    const { user } = varietiesPage('F', [aVariety()]);
    const card = await screen.findByRole('article', { name: 'Copperleaf Butterhead' });
    expect(asked).toBe(0); // nothing is asked for until the grower opens it
    await user.click(within(card).getByText('From your harvests of Copperleaf Butterhead'));
    expect(await within(card).findByText('1,008 °F-days')).toBeTruthy();
    expect(within(card).getByText(/^Only 2 harvests back this figure/)).toBeTruthy();
    await user.click(within(card).getByRole('button', { name: 'Use 1,008 °F-days as this variety’s target' }));
    await within(card).findByText(/^Saved: plantings of Copperleaf Butterhead now count toward 1,008 °F-days\./);
    const patch = seen.find((r) => r.method === 'PATCH' && r.path === '/api/gardens/1/varieties/7');
    expect(patch?.body).toEqual({ gddTargetOverrideC: 560 });
  });
});
