import { Workbox } from 'workbox-window';

/**
 * The service worker keeps the app's files and the last-seen records for a garden with no signal.
 * It takes over by itself (vite.config.ts: autoUpdate): the shell is a set of hashed files, and a
 * waiting older worker would keep serving a shell whose chunks the server no longer has.
 */
export function registerServiceWorker() {
  if (!('serviceWorker' in navigator)) return;
  const wb = new Workbox('/sw.js', { scope: '/' });
  // At once, not after the window's load event (Workbox's default): a page whose photos are slow
  // to arrive would put off its offline copy until they all had. Not being installable is no
  // reason for the app to fail: the page works as it is.
  wb.register({ immediate: true }).catch(() => undefined);
}
