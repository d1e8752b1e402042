import { ApiError } from '@/lib/api-client';
import { formatWait } from '@/lib/format';

/** What kind of trouble a failed call met, for the words and for what the grower can do. */
export type ProblemKind = 'offline' | 'timeout' | 'busy' | 'answer';

/** The same entry sent again while the first sending is still being saved (Idempotency-Key). */
const isStillSaving = (error: unknown) => error instanceof ApiError && error.status === 409 && error.code === 'request_in_progress';

export function problemKind(error: unknown): ProblemKind {
  if (!(error instanceof ApiError)) return 'answer';
  if (error.status === 0) return error.code === 'timeout' ? 'timeout' : 'offline';
  // A proxy in front of Heatclock answering for it: the app itself is down or not answering.
  if (error.status === 502) return 'offline';
  if (error.status === 504) return 'timeout';
  if (error.status === 503 || error.status === 429) return 'busy';
  if (isStillSaving(error)) return 'busy';
  return 'answer';
}

const wait = (error: unknown) => {
  const seconds = error instanceof ApiError ? error.retryAfterSeconds : undefined;
  return seconds === undefined ? 'in a moment' : `in ${formatWait(seconds)}`;
};

/** An overloaded server and one that lost its database both answer 503; they read differently. */
const unavailable = (error: unknown) =>
  error instanceof ApiError && error.code === 'database_unavailable' ? 'Heatclock can’t reach its records right now' : 'Heatclock is busy right now';

/** The words under a query that failed: what went wrong and what to do about it. */
export function loadProblem(error: unknown): string {
  switch (problemKind(error)) {
    case 'offline':
      return 'Can’t reach Heatclock. Check your connection and try again.';
    case 'timeout':
      // The client's own timeout says how long it waited; a proxy's 504 does not.
      return (error as ApiError).status === 0 ? (error as ApiError).message : 'Can’t reach Heatclock: no answer in time. Try again in a moment.';
    case 'busy':
      return `${unavailable(error)}. Try again ${wait(error)}.`;
    default:
      return error instanceof ApiError && error.message ? error.message : 'Something went wrong while loading. Try again.';
  }
}

/**
 * The words under a form whose save failed. When no answer came back, or the server was too busy
 * to take it, they say that what was typed is still there, so trying again costs nothing.
 * `kept` names what is still there ("the chosen file is kept").
 */
export function mutationProblem(error: unknown, kept = 'your entry is kept'): string {
  switch (problemKind(error)) {
    case 'offline':
      return `Can’t reach Heatclock — ${kept}, try again.`;
    case 'timeout':
      return `Can’t reach Heatclock: no answer in time — ${kept}. It may have been saved; check before trying again.`;
    case 'busy':
      if (isStillSaving(error)) return 'Already being saved — wait a moment, then try again; it will not be saved twice.';
      return `${unavailable(error)} — ${kept}, try again ${wait(error)}.`;
    default:
      return error instanceof ApiError && error.message ? error.message : `Something went wrong — ${kept}, try again.`;
  }
}

/**
 * A refusal for too many tries (429), or null for any other error: what was counted — the form's
 * own words, else the server's ("Too many e-mail change requests from your account") — and the
 * wait from Retry-After in words. Every form words it through here.
 */
export function tooManyProblem(error: unknown, counted?: string): string | null {
  if (!(error instanceof ApiError) || error.status !== 429) return null;
  const what = counted ?? /^Too many [^.]+/.exec(error.message)?.[0] ?? 'Too many tries';
  const wait = error.retryAfterSeconds === undefined ? 'a few minutes' : formatWait(error.retryAfterSeconds);
  return `${what}. Please wait ${wait}, then try again.`;
}
