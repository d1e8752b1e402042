import '@fontsource/roboto-flex';
import '@/app/styles.css';
import { StrictMode } from 'react';
import { createRoot } from 'react-dom/client';
import { RouterProvider } from 'react-router-dom';
import { AppProviders } from '@/app/providers';
import { createAppRouter } from '@/app/router';

const router = createAppRouter();

const root = document.getElementById('root');
if (!root) throw new Error('index.html must contain <div id="root">.');

createRoot(root).render(
  <StrictMode>
    <AppProviders>
      <RouterProvider router={router} />
    </AppProviders>
  </StrictMode>,
);
