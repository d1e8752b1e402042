/**
 * Heatclock's own mark: a garden thermometer with a leaf growing from its stem — heat kept as
 * time by a plant. Decorative; the word beside it carries the name.
 */
export function HeatclockMark({ className = 'size-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <path d="M19.5 10.5c1.2-3.6 4.6-5.6 8-5.4-.4 3.7-3.6 6.4-8 5.4z" className="fill-leaf" />
      <rect x="12" y="3" width="8" height="19" rx="4" className="fill-paper-raised stroke-loam" strokeWidth="2" />
      <path d="M20 8h-2.5M20 12h-2.5M20 16h-2.5" className="stroke-loam" strokeWidth="1.5" strokeLinecap="round" />
      <rect x="15" y="9" width="2" height="13" rx="1" className="fill-ember" />
      <circle cx="16" cy="24" r="5.5" className="fill-ember stroke-loam" strokeWidth="2" />
    </svg>
  );
}

/** `compact` is for the phone's top bar: the mark alone below 768 px (the name stays for screen readers). */
export function Wordmark({ compact = false }: { compact?: boolean }) {
  return (
    <span className="inline-flex shrink-0 items-center gap-2 text-xl font-bold tracking-tight text-loam">
      <HeatclockMark className={compact ? 'size-7 md:size-8' : 'size-8'} />
      <span className={compact ? 'sr-only md:not-sr-only' : undefined}>Heatclock</span>
    </span>
  );
}
