import { Wordmark } from '@/components/ui/wordmark';
import { NotFoundMessage } from '@/components/ui/not-found-message';

export function NotFoundPage() {
  return (
    <div className="mx-auto max-w-3xl px-4 py-6">
      <header className="mb-4">
        <Wordmark />
      </header>
      <main>
        <NotFoundMessage />
      </main>
    </div>
  );
}
