import { useSyncExternalStore } from 'react';

const WIDE = '(min-width: 40rem)';

function subscribeToWidth(onChange: () => void) {
  if (typeof window.matchMedia !== 'function') return () => {};
  const query = window.matchMedia(WIDE);
  query.addEventListener('change', onChange);
  return () => query.removeEventListener('change', onChange);
}

/** On a phone, weekly date ticks and long line labels collide; charts thin them out below 40rem. */
export function useWideChart(): boolean {
  return useSyncExternalStore(subscribeToWidth, () => typeof window.matchMedia !== 'function' || window.matchMedia(WIDE).matches);
}
