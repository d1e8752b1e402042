import '@fontsource-variable/roboto-flex';
import '@/app/styles.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router-dom';
import { AppProviders, appQueryClient } from '@/app/providers';
import { createAppRouter } from '@/app/router';
import { meQueryOptions } from '@/features/auth/api/get-me';
import { registerServiceWorker } from '@/features/offline/register-service-worker';

// Every page waits on the session check: ask for it before the page downloads take up the
// browser's few connections to the server.
void appQueryClient.prefetchQuery(meQueryOptions());
const router = createAppRouter();
if (import.meta.env.PROD) registerServiceWorker();

const root = document.getElementById('root');
if (!root) throw new Error('index.html must contain <div id="root">.');

createRoot(root).render(
  <StrictMode>
    <AppProviders>
      <RouterProvider router={router} />
    </AppProviders>
  </StrictMode>,
);
