import { createBrowserRouter } from 'react-router-dom';
import type { RouteObject } from 'react-router-dom';
import { NotFoundMessage } from '@/components/ui/not-found-message';
import { RequireAuth } from '@/features/auth/components/require-auth';
import { RegisterPage } from '@/app/routes/auth/register';
import { SignInPage } from '@/app/routes/auth/sign-in';
import { FirstGardenPage } from '@/app/routes/gardens/first-garden';
import { GardenLayout } from '@/app/routes/gardens/garden-layout';
import { GardenSettingsPage } from '@/app/routes/gardens/garden-settings';
import { TodayPage } from '@/app/routes/gardens/today';
import { NotFoundPage } from '@/app/routes/misc/not-found';
import { WeatherPage } from '@/app/routes/weather/weather';
import { PlantingsPage } from '@/app/routes/plantings/plantings';
import { PlantingDetailPage } from '@/app/routes/plantings/planting-detail';
import { VarietiesPage } from '@/app/routes/varieties/varieties';
import { SeedLotsPage } from '@/app/routes/seed-lots/seed-lots';
import { BedsPage } from '@/app/routes/beds/beds';
import { CropsPage } from '@/app/routes/crops/crops';
import { MailboxPage } from '@/app/routes/mailbox/mailbox';
import { UnsubscribePage } from '@/app/routes/unsubscribe/unsubscribe';
import { AlertsPage } from '@/app/routes/alerts/alerts';

export const routes: RouteObject[] = [
  { path: '/sign-in', element: <SignInPage /> },
  { path: '/register', element: <RegisterPage /> },
  // Opened from an e-mail, often on a device that is not signed in.
  { path: '/unsubscribe/:token', element: <UnsubscribePage /> },
  {
    element: <RequireAuth />,
    children: [
      { path: '/', element: <FirstGardenPage /> },
      { path: '/mailbox', element: <MailboxPage /> },
      {
        path: '/g/:gardenId',
        element: <GardenLayout />,
        children: [
          { index: true, element: <TodayPage /> },
          { path: 'plantings', element: <PlantingsPage /> },
          { path: 'plantings/:plantingId', element: <PlantingDetailPage /> },
          { path: 'varieties', element: <VarietiesPage /> },
          { path: 'seed-lots', element: <SeedLotsPage /> },
          { path: 'beds', element: <BedsPage /> },
          { path: 'crops', element: <CropsPage /> },
          { path: 'weather', element: <WeatherPage /> },
          { path: 'alerts', element: <AlertsPage /> },
          { path: 'settings', element: <GardenSettingsPage /> },
          // Inside a garden, an unknown page keeps the header so the grower can find their way.
          { path: '*', element: <NotFoundMessage /> },
        ],
      },
    ],
  },
  { path: '*', element: <NotFoundPage /> },
];

export function createAppRouter() {
  return createBrowserRouter(routes);
}
