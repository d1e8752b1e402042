import { useCallback, useRef } from 'react';

/** 128 random bits as text; randomUUID exists only on secure origins, so a plain-http install gets hex. */
export function newSubmissionKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  return Array.from(crypto.getRandomValues(new Uint8Array(16)), (b) => b.toString(16).padStart(2, '0')).join('');
}

/**
 * The Idempotency-Key of one entry a form sends. `keyFor(entry)` gives the key the same entry was
 * last sent with, so a retry after no answer (or a double tap) is stored once however often it
 * arrives; a changed entry gets a key of its own, since the server refuses one key for two bodies.
 * `renew()` after a success: the same entry sent again on purpose is another record.
 *
 * `entry` is what is sent, as plain data; for a file, what names it (name, size, date).
 */
export function useSubmissionKey() {
  const current = useRef<{ key: string; entry: string } | null>(null);
  const keyFor = useCallback((entry: unknown) => {
    const print = JSON.stringify(entry);
    if (current.current?.entry !== print) current.current = { key: newSubmissionKey(), entry: print };
    return current.current.key;
  }, []);
  const renew = useCallback(() => {
    current.current = null;
  }, []);
  return { keyFor, renew };
}
