export interface ChartLineLabelProps {
  viewBox?: { x?: number; y?: number; width?: number };
  text: string;
  colour: string;
  side: 'left' | 'right';
  below: boolean;
}

/**
 * The words of a horizontal chart line (a threshold, a target), with a paper-coloured halo so
 * they stay readable across the data. Recharts passes `viewBox`; the rest comes from the chart.
 */
export function ChartLineLabel({ viewBox, text, colour, side, below }: ChartLineLabelProps) {
  if (viewBox?.x == null || viewBox.y == null || viewBox.width == null) return null;
  return (
    <HaloText x={side === 'left' ? viewBox.x + 6 : viewBox.x + viewBox.width - 6} y={below ? viewBox.y + 14 : viewBox.y - 5} anchor={side === 'left' ? 'start' : 'end'} colour={colour}>
      {text}
    </HaloText>
  );
}

/** Chart words with a paper-coloured halo, readable over lines and bands. */
export function HaloText({ x, y, anchor, colour, children }: { x: number; y: number; anchor: 'start' | 'middle' | 'end'; colour: string; children: string }) {
  return (
    <text x={x} y={y} textAnchor={anchor} fill={colour} fontSize={12} fontWeight={600} stroke="var(--color-paper-raised)" strokeWidth={4} strokeLinejoin="round" paintOrder="stroke">
      {children}
    </text>
  );
}
