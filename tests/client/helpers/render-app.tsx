import { render } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClient } from '@tanstack/react-query';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import type { RouteObject } from 'react-router-dom';
import { http, HttpResponse } from 'msw';
import type { UserDto } from '#shared/schemas/auth';
import type { GardenDto } from '#shared/schemas/gardens';
import { AppProviders } from '@/app/providers';
import { routes } from '@/app/router';
import { aClimate, aToday } from './data';

function everyRoute(list: RouteObject[]): RouteObject[] {
  return list.flatMap((route) => [route, ...everyRoute(route.children ?? [])]);
}

/**
 * In the app each page downloads when first shown. Here every page is imported once per test
 * file before any test runs, so a test meets its page ready instead of racing the first import.
 * (tests/client/lazy-part.test.tsx covers the loading line and a failed download.)
 */
await Promise.all(everyRoute(routes).map((route) => (route.handle as { preload?: () => Promise<unknown> } | undefined)?.preload?.() ?? Promise.resolve()));

/** Renders the whole app at `path` with a fresh client that never retries. */
export function renderApp(path: string) {
  const queryClient = new QueryClient({
    defaultOptions: { queries: { retry: false }, mutations: { retry: false } },
  });
  const router = createMemoryRouter(routes, { initialEntries: [path] });
  const user = userEvent.setup();
  const view = render(
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>,
  );
  return { ...view, user, router, queryClient };
}

export function signedInAs(user: UserDto) {
  return http.get('/api/auth/me', () => HttpResponse.json({ user }));
}

export const signedOut = http.get('/api/auth/me', () =>
  HttpResponse.json({ error: { code: 'unauthenticated', message: 'Please sign in.' } }, { status: 401 }),
);

export function memberOf(gardens: GardenDto[]) {
  return [
    http.get('/api/gardens', () => HttpResponse.json({ gardens })),
    http.get('/api/gardens/:gardenId', ({ params }) => {
      const garden = gardens.find((g) => String(g.id) === params.gardenId);
      return garden
        ? HttpResponse.json({ garden })
        : HttpResponse.json({ error: { code: 'not_found', message: 'Garden not found.' } }, { status: 404 });
    }),
    ...quietAlerts,
    quietPreferences,
    http.get('/api/gardens/:gardenId/mail/failed', () => HttpResponse.json({ items: [] })),
    // The settings page's "Climate here": a garden with no stored weather yet.
    http.get('/api/gardens/:gardenId/climate', () => HttpResponse.json({ climate: aClimate() })),
    // Its "Winter chill for fruit": nothing counted yet.
    http.get('/api/gardens/:gardenId/chill', () =>
      HttpResponse.json({ since: '2026-10-01', through: null, until: '2027-04-30', seasonEnded: false, hoursAtOrBelow7C: 0, utahUnits: 0, method: 'linvill-1990-from-daily', estimated: true, daysCounted: 0, daysMissing: 0, fruit: [] }),
    ),
    // The Plan page's and the new-planting form's soil: no temperature known yet.
    http.get('/api/gardens/:gardenId/soil', () => HttpResponse.json({ unit: 'F', current: null, forecast: [], readings: [], crops: [], emergenceSource: 'test' })),
  ];
}

/** No e-mail preferences saved: the settings page asks for them for every role. */
export const quietPreferences = http.get('/api/me/notification-preferences', () => HttpResponse.json({ items: [] }));

/** No alerts: the navigation's count and Today's open alerts, asked for on every garden page. */
export const quietAlerts = [
  http.get('/api/gardens/:gardenId/alerts/counts', () => HttpResponse.json({ open: 0, byType: {} })),
  http.get('/api/gardens/:gardenId/alerts', () => HttpResponse.json({ items: [] })),
];

/** Today with nothing to show, for tests that land on a garden's home page but look elsewhere. */
export const quietToday = http.get('/api/gardens/:gardenId/today', () => HttpResponse.json(aToday({ actions: [], plantings: [], weather: [] })));
