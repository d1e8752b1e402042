/**
 * How seasons are told apart on the comparison chart: each by a shape and a colour, so neither
 * alone carries the difference. The legend draws the same shapes as the chart.
 */
export type MarkShape = 'circle' | 'triangle' | 'square' | 'diamond' | 'cross' | 'star';

export interface SeasonMark {
  shape: MarkShape;
  /** Shape named in words for the legend. */
  shapeWords: string;
  color: string;
}

const MARKS: readonly SeasonMark[] = [
  { shape: 'circle', shapeWords: 'circle', color: 'var(--color-frost)' },
  { shape: 'triangle', shapeWords: 'triangle', color: 'var(--color-ember)' },
  { shape: 'square', shapeWords: 'square', color: 'var(--color-leaf)' },
  { shape: 'diamond', shapeWords: 'diamond', color: 'var(--color-loam)' },
  { shape: 'cross', shapeWords: 'cross', color: 'var(--color-loam-soft)' },
  { shape: 'star', shapeWords: 'star', color: 'var(--color-clay)' },
];

/** The mark of the k-th season shown (oldest first); after six they repeat. */
export function seasonMark(k: number): SeasonMark {
  return MARKS[k % MARKS.length];
}

/** A small drawing of a mark, for the legend. */
export function MarkIcon({ mark, size = 14 }: { mark: SeasonMark; size?: number }) {
  const s = size;
  const h = s / 2;
  const shapes: Record<MarkShape, React.ReactNode> = {
    circle: <circle cx={h} cy={h} r={h - 1} />,
    triangle: <polygon points={`${h},1 ${s - 1},${s - 1} 1,${s - 1}`} />,
    square: <rect x={1.5} y={1.5} width={s - 3} height={s - 3} />,
    diamond: <polygon points={`${h},0.5 ${s - 0.5},${h} ${h},${s - 0.5} 0.5,${h}`} />,
    cross: <path d={`M${h * 0.65},1h${h * 0.7}v${h * 0.65}h${h * 0.65}v${h * 0.7}h-${h * 0.65}v${h * 0.65}h-${h * 0.7}v-${h * 0.65}h-${h * 0.65}v-${h * 0.7}h${h * 0.65}z`} />,
    star: <polygon points={starPoints(h, h, h - 0.5, (h - 0.5) * 0.45)} />,
  };
  return (
    <svg width={s} height={s} viewBox={`0 0 ${s} ${s}`} aria-hidden="true" focusable="false" fill={mark.color} className="inline-block shrink-0">
      {shapes[mark.shape]}
    </svg>
  );
}

function starPoints(cx: number, cy: number, outer: number, inner: number): string {
  return Array.from({ length: 10 }, (_, k) => {
    const r = k % 2 ? inner : outer;
    const a = (Math.PI / 5) * k - Math.PI / 2;
    return `${(cx + r * Math.cos(a)).toFixed(2)},${(cy + r * Math.sin(a)).toFixed(2)}`;
  }).join(' ');
}
