import type { ReactNode } from 'react';
import { CircleAlert, CircleCheck, Info } from 'lucide-react';

type Tone = 'error' | 'success' | 'info';

// Tone is always carried by a word and an icon as well as colour.
const TONES: Record<Tone, { box: string; icon: typeof Info; word: string }> = {
  error: { box: 'border-clay bg-clay-tint text-clay', icon: CircleAlert, word: 'Problem' },
  success: { box: 'border-leaf bg-leaf-tint text-leaf', icon: CircleCheck, word: 'Done' },
  info: { box: 'border-frost bg-frost-tint text-frost', icon: Info, word: 'Note' },
};

export function Notice({
  tone,
  title,
  children,
  live,
}: {
  tone: Tone;
  title?: string;
  children: ReactNode;
  /** 'alert' interrupts screen readers (errors after a submit); 'status' waits politely. */
  live?: 'alert' | 'status';
}) {
  const { box, icon: Icon, word } = TONES[tone];
  return (
    <div role={live} className={`flex gap-3 rounded-md border-l-4 px-4 py-3 ${box}`}>
      <Icon className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
      <div className="text-loam">
        <p className="font-semibold">{title ?? word}</p>
        <div>{children}</div>
      </div>
    </div>
  );
}
