import type { ReactNode } from 'react';
import { Wordmark } from '@/components/ui/wordmark';

export function AuthFrame({ title, intro, children }: { title: string; intro: string; children: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col items-center px-4 py-10">
      <title>{`${title} · Heatclock`}</title>
      <header className="mb-6">
        <Wordmark />
      </header>
      <main className="w-full max-w-md rounded-lg border border-line bg-paper-raised p-6 shadow-sm sm:p-8">
        <h1 className="text-2xl font-bold">{title}</h1>
        <p className="mt-1 mb-6 text-loam-soft">{intro}</p>
        {children}
      </main>
    </div>
  );
}
