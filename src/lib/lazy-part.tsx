import { Component, lazy, Suspense, useEffect, useReducer, useState } from 'react';
import type { ComponentType, LazyExoticComponent, ReactNode } from 'react';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';

/** A download of a part's code that did not arrive (offline, or the server was unreachable). */
class DownloadError extends Error {
  constructor(cause: unknown) {
    super('The code for this part of Heatclock could not be downloaded.', { cause });
    this.name = 'DownloadError';
  }
}

type Words = {
  /** Shown while the code downloads, e.g. "Opening the page…". */
  loading: string;
  /** Title of the message when it cannot be downloaded, e.g. "This page could not be loaded". */
  failed: string;
};

type BoundaryProps = Words & { onRetry: () => void; children: ReactNode };

/** Catches only failed downloads; any other error goes on to the boundary above. */
class DownloadBoundary extends Component<BoundaryProps, { error: unknown }> {
  state: { error: unknown } = { error: null };

  static getDerivedStateFromError(error: unknown) {
    return { error };
  }

  retry = () => {
    this.props.onRetry();
    this.setState({ error: null });
  };

  render() {
    const { error } = this.state;
    if (!error) return this.props.children;
    // Not ours to show: the next boundary up gets it, as React would pass it on.
    if (!(error instanceof DownloadError)) throw error instanceof Error ? error : new Error('A page part failed.', { cause: error });
    return (
      <div className="flex flex-col items-start gap-3 py-6">
        <Notice tone="error" title={this.props.failed} live="alert">
          Part of Heatclock did not download, usually because the connection dropped. Check that you are online, then
          try again.
        </Notice>
        <Button variant="quiet" onClick={this.retry}>
          Try again
        </Button>
      </div>
    );
  }
}

export type LazyPart<P extends object> = ComponentType<P> & {
  /** Starts the download early, e.g. as soon as the address is known; safe to call often. */
  preload: () => Promise<unknown>;
};

/**
 * A component whose code is downloaded the first time it is shown, with its own loading line and
 * a retry when the download fails. React.lazy keeps a failure for good, so a failed download is
 * forgotten here: the next showing, or "Try again", gets a fresh lazy component that asks again.
 */
export function lazyPart<P extends object>(load: () => Promise<ComponentType<P>>, words: Words): LazyPart<P> {
  type Shown = ComponentType<P> | LazyExoticComponent<ComponentType<P>>;
  const ignore = () => undefined;
  let loaded: ComponentType<P> | undefined;
  let download: Promise<{ default: ComponentType<P> }> | undefined;
  const start = () =>
    (download ??= load().then(
      (part) => ({ default: (loaded = part) }),
      (cause: unknown) => {
        download = undefined;
        throw new DownloadError(cause);
      },
    ));

  function Lazy(props: P) {
    // Chosen once per mount, so the part is never swapped (and its state lost) when it arrives;
    // code already here (preloaded) shows at once, without even a moment of loading line.
    const [Part, setPart] = useState<Shown>(() => loaded ?? lazy(start));
    // React shows content that replaces a loading line at least 300 ms after the line appeared
    // (it batches reveals on retry). Re-rendering from here when the code arrives is an ordinary
    // update, so the part shows as soon as it is ready, not up to 300 ms later.
    const [, arrived] = useReducer((n: number) => n + 1, 0);
    useEffect(() => {
      if (!loaded) start().then(arrived, ignore);
    }, [Part]);
    return (
      <DownloadBoundary {...words} onRetry={() => setPart(() => lazy(start))}>
        <Suspense fallback={<Loading label={words.loading} />}>
          <Part {...props} />
        </Suspense>
      </DownloadBoundary>
    );
  }

  // The part shows its own message when it is opened; an early download that fails stays quiet.
  const preload = () => start().then(ignore, ignore);
  return Object.assign(Lazy, { preload });
}
