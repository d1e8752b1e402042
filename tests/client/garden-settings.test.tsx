// @vitest-environment jsdom
import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { GardenDto } from '#shared/schemas/gardens';
import { seen, server, setupClientTests } from './helpers/msw-server';
import { aGarden, grower } from './helpers/data';
import { memberOf, renderApp, signedInAs } from './helpers/render-app';

setupClientTests();

function patches() {
  return seen.filter((r) => r.method === 'PATCH');
}

describe('garden settings', () => {
  it('when a viewer opens settings, then the facts are read-only and no save is offered', async () => {
    server.use(signedInAs(grower), ...memberOf([aGarden({ role: 'viewer' })]));
    renderApp('/g/1/settings');

    expect(await screen.findByText('Only the garden’s owner can change these settings.')).toBeTruthy();
    expect(screen.queryByRole('textbox')).toBeNull();
    expect(screen.queryByRole('radio')).toBeNull();
    expect(screen.queryByRole('button', { name: /save/i })).toBeNull();
    expect(screen.getByText('44.52° N, 72.81° W')).toBeTruthy();
    // A °F garden reads its elevation in feet: 210 m is 689 ft (1 ft = 0.3048 m).
    expect(screen.getByText('689 ft')).toBeTruthy();
    expect(screen.getByText('°F (Fahrenheit)')).toBeTruthy();
  });

  it('when an owner changes the name, location and units, then one PATCH carries them and the page says saved', async () => {
    let stored = aGarden();
    server.use(
      signedInAs(grower),
      // Listed first so the list reflects saved edits; MSW uses the first matching handler.
      http.get('/api/gardens', () => HttpResponse.json({ gardens: [stored] })),
      ...memberOf([stored]),
      http.patch('/api/gardens/:gardenId', async ({ request }) => {
        stored = { ...stored, ...((await request.json()) as Partial<GardenDto>) };
        stored.hemisphere = (stored.latitude ?? 0) < 0 ? 'S' : 'N';
        return HttpResponse.json({ garden: stored });
      }),
    );
    const { user } = renderApp('/g/1/settings');

    const name = await screen.findByLabelText('Garden name');
    await user.clear(name);
    await user.type(name, '  Wattle Creek School Garden ');
    await user.clear(screen.getByLabelText('Latitude (decimal degrees, °)'));
    await user.type(screen.getByLabelText('Latitude (decimal degrees, °)'), '-37.81');
    await user.clear(screen.getByLabelText('Longitude (decimal degrees, °)'));
    await user.type(screen.getByLabelText('Longitude (decimal degrees, °)'), '144.96');
    await user.clear(screen.getByLabelText('Elevation (m)'));
    await user.clear(screen.getByLabelText('Time zone'));
    await user.type(screen.getByLabelText('Time zone'), 'Australia/Melbourne');
    await user.click(screen.getByRole('radio', { name: '°C (Celsius)' }));
    expect(screen.getByText('You have unsaved changes.')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Save settings' }));

    expect(await screen.findByText('Settings saved.')).toBeTruthy();
    const [patch] = patches();
    expect(patch.path).toBe('/api/gardens/1');
    expect(patch.headers.get('x-requested-with')).toBe('heatclock');
    expect(patch.headers.get('content-type')).toBe('application/json');
    expect(patch.body).toEqual({
      name: 'Wattle Creek School Garden',
      latitude: -37.81,
      longitude: 144.96,
      elevationM: null,
      timeZone: 'Australia/Melbourne',
      units: 'C',
    });
    // The switcher learns about the rename from the refreshed list.
    const switcher = screen.getByRole('combobox', { name: 'Garden' });
    expect(await within(switcher).findByRole('option', { name: 'Wattle Creek School Garden (Owner)' })).toBeTruthy();
  });

  it('when a coordinate is not a number or half missing, then the field says why and nothing is sent', async () => {
    server.use(signedInAs(grower), ...memberOf([aGarden()]));
    const { user } = renderApp('/g/1/settings');

    const latitude = await screen.findByLabelText('Latitude (decimal degrees, °)');
    await user.clear(latitude);
    await user.type(latitude, '44,52');
    await user.clear(screen.getByLabelText('Longitude (decimal degrees, °)'));
    await user.click(screen.getByRole('button', { name: 'Save settings' }));

    expect(await screen.findByText('Latitude must be a number.')).toBeTruthy();
    await user.clear(latitude);
    await user.type(latitude, '44.52');
    await user.click(screen.getByRole('button', { name: 'Save settings' }));

    expect(await screen.findByText('Enter a longitude; a location needs both numbers.')).toBeTruthy();
    expect(patches()).toHaveLength(0);
  });

  it('when the server rejects the time zone, then its message shows under the time zone field', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.patch('/api/gardens/:gardenId', () =>
        HttpResponse.json(
          {
            error: {
              code: 'validation_failed',
              message: 'Some fields need attention.',
              fields: { timeZone: 'This server does not know that time zone.' },
            },
          },
          { status: 400 },
        ),
      ),
    );
    const { user } = renderApp('/g/1/settings');

    await user.click(await screen.findByRole('radio', { name: '°C (Celsius)' }));
    await user.click(screen.getByRole('button', { name: 'Save settings' }));

    const message = await screen.findByText('This server does not know that time zone.');
    expect(screen.getByLabelText('Time zone').getAttribute('aria-describedby')).toContain(message.id);
    expect(screen.queryByText('Settings saved.')).toBeNull();
  });

  it('when the owner was demoted meanwhile, then the 403 is shown in words', async () => {
    server.use(
      signedInAs(grower),
      ...memberOf([aGarden()]),
      http.patch('/api/gardens/:gardenId', () =>
        HttpResponse.json(
          { error: { code: 'forbidden', message: 'Only the garden’s owner can do that.' } },
          { status: 403 },
        ),
      ),
    );
    const { user } = renderApp('/g/1/settings');

    await user.click(await screen.findByRole('radio', { name: '°C (Celsius)' }));
    await user.click(screen.getByRole('button', { name: 'Save settings' }));

    expect((await screen.findByRole('alert')).textContent).toContain('Only the garden’s owner can do that.');
  });

  it('when the chill season is over (a southern garden in summer), then the panel says the totals are last winter’s', async () => {
    server.use(
      http.get('/api/gardens/:gardenId/chill', () =>
        HttpResponse.json({ since: '2026-04-01', through: '2026-10-31', until: '2026-10-31', seasonEnded: true, hoursAtOrBelow7C: 2934, utahUnits: 1827, method: 'linvill-1990-from-daily', estimated: true, daysCounted: 214, daysMissing: 0, fruit: [] }),
      ),
      signedInAs(grower),
      ...memberOf([aGarden({ role: 'viewer', latitude: -42.88, longitude: 147.33, hemisphere: 'S', units: 'C' })]),
    );
    renderApp('/g/1/settings');
    expect(await screen.findByText('Last winter’s totals: the chill season ran until Oct 31; counting starts again on Apr 1.')).toBeTruthy();
    expect(screen.getByText('2,934 h')).toBeTruthy();
  });
});
