import { RotateCw } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { loadProblem } from '@/lib/problems';

const capital = (words: string) => `${words.charAt(0).toUpperCase()}${words.slice(1)}`;

/**
 * A query that failed, in words, with a Try again that asks once more. `what` names what did
 * not load ("the seed lots"); the title says so, the body why and what to do: no connection,
 * no answer in time, the server busy (and for how long), or the server's own words.
 */
export function LoadProblem({
  error,
  what,
  onRetry,
  retrying = false,
  compact = false,
}: {
  error: unknown;
  what: string;
  onRetry: () => unknown;
  /** True while the query is fetching again; the button says so and waits. */
  retrying?: boolean;
  /** One line and a button, for a part of a card or a section. */
  compact?: boolean;
}) {
  const title = `${capital(what)} could not be loaded — try again`;
  const button = (
    <Button variant="quiet" onClick={() => onRetry()} disabled={retrying} className="self-start">
      <RotateCw className={`size-4 ${retrying ? 'animate-spin motion-reduce:animate-none' : ''}`} aria-hidden="true" />
      {retrying ? 'Trying again…' : 'Try again'}
    </Button>
  );
  if (compact) {
    return (
      <div className="flex flex-col items-start gap-2">
        <p role="alert" className="text-clay">
          <span className="font-semibold">{capital(what)} could not be loaded.</span> <span className="text-loam">{loadProblem(error)}</span>
        </p>
        {button}
      </div>
    );
  }
  return (
    <div className="flex flex-col items-start gap-3">
      <Notice tone="error" title={title} live="alert">
        {loadProblem(error)}
      </Notice>
      {button}
    </div>
  );
}
