import { createBrowserRouter, matchRoutes } from 'react-router-dom';
import type { RouteObject } from 'react-router-dom';
import type { ComponentType } from 'react';
import { NotFoundMessage } from '@/components/ui/not-found-message';
import { RequireAuth } from '@/features/auth/components/require-auth';
import { lazyPart } from '@/lib/lazy-part';

type PageHandle = { preload: () => Promise<unknown> };

/**
 * Each page is its own chunk, downloaded when first shown. Its loading line and download
 * failure appear where the page goes, so inside a garden the header stays in place.
 */
function page(load: () => Promise<ComponentType>): Pick<RouteObject, 'element' | 'handle'> {
  const Page = lazyPart(load, { loading: 'Opening the page…', failed: 'This page could not be loaded' });
  return { element: <Page />, handle: { preload: Page.preload } satisfies PageHandle };
}

export const routes: RouteObject[] = [
  { path: '/sign-in', ...page(() => import('@/app/routes/auth/sign-in').then((m) => m.SignInPage)) },
  { path: '/register', ...page(() => import('@/app/routes/auth/register').then((m) => m.RegisterPage)) },
  // Opened from the sign-up e-mail; needs no sign-in.
  { path: '/register/confirm/:token', ...page(() => import('@/app/routes/auth/register-confirm').then((m) => m.RegisterConfirmPage)) },
  // Opened from an invitation e-mail; shows the garden before anyone signs in.
  { path: '/invitations/:token', ...page(() => import('@/app/routes/invitations/invitation').then((m) => m.InvitationPage)) },
  { path: '/forgot-password', ...page(() => import('@/app/routes/auth/forgot-password').then((m) => m.ForgotPasswordPage)) },
  // Opened from the reset e-mail; needs no sign-in.
  { path: '/reset-password/:token', ...page(() => import('@/app/routes/auth/reset-password').then((m) => m.ResetPasswordPage)) },
  // Opened from an e-mail, often on a device that is not signed in.
  { path: '/unsubscribe/:token', ...page(() => import('@/app/routes/unsubscribe/unsubscribe').then((m) => m.UnsubscribePage)) },
  {
    element: <RequireAuth />,
    children: [
      { path: '/', ...page(() => import('@/app/routes/gardens/first-garden').then((m) => m.FirstGardenPage)) },
      { path: '/mailbox', ...page(() => import('@/app/routes/mailbox/mailbox').then((m) => m.MailboxPage)) },
      { path: '/account', ...page(() => import('@/app/routes/account/account').then((m) => m.AccountPage)) },
      { path: '/account/confirm-email/:token', ...page(() => import('@/app/routes/account/confirm-email').then((m) => m.ConfirmEmailPage)) },
      {
        path: '/g/:gardenId',
        ...page(() => import('@/app/routes/gardens/garden-layout').then((m) => m.GardenLayout)),
        children: [
          { index: true, ...page(() => import('@/app/routes/gardens/today').then((m) => m.TodayPage)) },
          { path: 'plantings', ...page(() => import('@/app/routes/plantings/plantings').then((m) => m.PlantingsPage)) },
          {
            path: 'plantings/:plantingId',
            ...page(() => import('@/app/routes/plantings/planting-detail').then((m) => m.PlantingDetailPage)),
          },
          { path: 'varieties', ...page(() => import('@/app/routes/varieties/varieties').then((m) => m.VarietiesPage)) },
          { path: 'seed-lots', ...page(() => import('@/app/routes/seed-lots/seed-lots').then((m) => m.SeedLotsPage)) },
          { path: 'beds', ...page(() => import('@/app/routes/beds/beds').then((m) => m.BedsPage)) },
          { path: 'crops', ...page(() => import('@/app/routes/crops/crops').then((m) => m.CropsPage)) },
          { path: 'plan', ...page(() => import('@/app/routes/plan/plan').then((m) => m.PlanPage)) },
          { path: 'compare', ...page(() => import('@/app/routes/compare/compare').then((m) => m.ComparePage)) },
          { path: 'weather', ...page(() => import('@/app/routes/weather/weather').then((m) => m.WeatherPage)) },
          { path: 'alerts', ...page(() => import('@/app/routes/alerts/alerts').then((m) => m.AlertsPage)) },
          { path: 'settings', ...page(() => import('@/app/routes/gardens/garden-settings').then((m) => m.GardenSettingsPage)) },
          { path: 'members', ...page(() => import('@/app/routes/members/members').then((m) => m.MembersPage)) },
          { path: 'audit', ...page(() => import('@/app/routes/audit/audit').then((m) => m.AuditPage)) },
          // Inside a garden, an unknown page keeps the header so the grower can find their way.
          { path: '*', element: <NotFoundMessage /> },
        ],
      },
    ],
  },
  { path: '*', ...page(() => import('@/app/routes/misc/not-found').then((m) => m.NotFoundPage)) },
];

/**
 * Starts downloading every page the address shows (a garden's layout and its page together)
 * while the session is still being checked, instead of one after the other.
 */
function preloadPagesFor(pathname: string) {
  for (const match of matchRoutes(routes, pathname) ?? []) void (match.route.handle as PageHandle | undefined)?.preload();
}

export function createAppRouter() {
  const router = createBrowserRouter(routes);
  preloadPagesFor(router.state.location.pathname);
  router.subscribe((state) => preloadPagesFor(state.location.pathname));
  return router;
}
