import type { ReactNode } from 'react';

export interface LegendItem {
  /** SVG content drawn in a 28 × 12 box. */
  swatch: ReactNode;
  words: string;
}

/** How to read a chart: each mark drawn small beside its words, so no colour stands alone. */
export function ChartLegend({ items, className }: { items: LegendItem[]; className: string }) {
  return (
    <ul aria-label="How to read the chart" className={className}>
      {items.map(({ swatch, words }) => (
        <li key={words} className="flex items-center gap-2">
          <svg viewBox="0 0 28 12" className="h-3 w-7 shrink-0" aria-hidden="true" focusable="false">
            {swatch}
          </svg>
          {words}
        </li>
      ))}
    </ul>
  );
}
