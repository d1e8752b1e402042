// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server, setupClientTests } from './helpers/msw-server';
import { aCrop, aGarden, aParam, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

// Sources worded as the library words them for engineers, with their internal marks.
const crop = aCrop([
  aParam({ source: 'Extension default for cool-season crops, base 40 °F (4.4 °C) (from memory)', confidence: 'L' }),
  aParam({ key: 'upperC', label: 'Upper threshold', value: null, source: 'Base-40 °F practice for cool-season crops sets no upper threshold (Heatclock default)', confidence: 'M' }),
  aParam({ key: 'vernalizationDays', label: 'Vernalization: cold days needed', value: null, source: 'SCIENCE §4: no figure in the library defaults (M)', confidence: 'L' }),
  aParam({ key: 'blossomDropWatchC', label: 'Blossom drop: watch from', value: null, source: 'common practice, no source', confidence: 'L' }),
]);

describe('crop library in plain words', () => {
  it('when a grower opens a crop, then no internal marks show, and figures with no value wait behind one line', async () => {
    server.use(signedInAs(grower), ...memberOf([aGarden({ role: 'grower' })]), http.get('/api/gardens/1/crops', () => HttpResponse.json({ crops: [crop] })));
    const user = userEvent.setup();
    renderApp('/g/1/crops');
    await user.click(await screen.findByText(crop.name));
    const page = document.body.textContent ?? '';
    expect(page).not.toMatch(/SCIENCE|§|from memory|no source/);
    expect(page).toContain('a commonly given figure, not checked against a published table');
    const folded = screen.getAllByText(/with no value for/);
    expect(folded.length).toBeGreaterThan(0);
    const details = folded[0].closest('details')!;
    expect(details.open).toBe(false);
    expect(within(details).getAllByText(/Vernalization: cold days needed|Blossom drop: watch from/)).toHaveLength(2);
    expect(within(details).getByText(/^3 figures/)).toBeTruthy();
  });
});
