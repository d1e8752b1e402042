import { LoaderCircle } from 'lucide-react';
import { Wordmark } from '@/components/ui/wordmark';

export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <p role="status" className="flex items-center gap-2 py-8 text-loam-soft">
      <LoaderCircle className="size-5 animate-spin motion-reduce:animate-none" aria-hidden="true" />
      {label}
    </p>
  );
}

/**
 * A loading line for the moment before Heatclock knows which page it will show (the session is
 * being checked): the bar and page column every signed-in page has, so nothing jumps when it arrives.
 */
export function PageLoading({ label }: { label: string }) {
  return (
    <div className="min-h-dvh">
      <header className="border-b border-line bg-paper-sunk">
        <div className="mx-auto flex min-h-[3.75rem] max-w-5xl items-center px-4 py-2 md:py-3">
          <Wordmark compact />
        </div>
      </header>
      <main className="mx-auto max-w-5xl px-4 py-6">
        <Loading label={label} />
      </main>
    </div>
  );
}
