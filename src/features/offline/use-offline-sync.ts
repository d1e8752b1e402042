import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { flushQueue, useQueuedItems } from '@/lib/offline-queue';
import { invalidateGardenFigures } from '@/lib/progress-root-key';

/** While entries wait, a flush this often catches a connection the browser did not announce. */
export const FLUSH_EVERY_MS = 20_000;

/**
 * Sends what waits on this device: at start, when the browser says it is back online, and on a
 * timer while anything waits. What arrived refreshes the records it changed.
 */
export function useOfflineSync() {
  const queryClient = useQueryClient();
  const waiting = useQueuedItems().some((i) => i.status === 'waiting');

  useEffect(() => {
    let stopped = false;
    const flush = () =>
      void flushQueue().then(({ sent }) => {
        if (stopped) return;
        for (const gardenId of new Set(sent.map((i) => i.gardenId))) {
          void queryClient.invalidateQueries({ queryKey: ['plantings', gardenId] });
          void invalidateGardenFigures(queryClient, gardenId);
        }
      }, () => undefined);
    flush();
    window.addEventListener('online', flush);
    const timer = waiting ? setInterval(flush, FLUSH_EVERY_MS) : undefined;
    return () => {
      stopped = true;
      window.removeEventListener('online', flush);
      clearInterval(timer);
    };
  }, [queryClient, waiting]);
}
