import { configure } from '@testing-library/react';

/**
 * How long a client test waits for what a person waits to see: a page, an answer, a message.
 * Passing tests never wait it out (each find ends as soon as the words show); it only has to
 * outlast a busy machine, where every test file runs at once on two cores beside the API tests
 * and a page can take seconds. Where the app itself waits first (a poll, a retry's pause), a test
 * adds that wait to this one rather than guessing a number.
 */
export const CLIENT_WAIT_MS = 10_000;

/** Call once at the top of a client test file (setupClientTests does). */
export function useClientWaits() {
  configure({ asyncUtilTimeout: CLIENT_WAIT_MS });
}
