/** Colours and plot insets of the progress chart, outside its lazy chunk so the legend and strip can use them. */
export const PROGRESS_COLOURS = {
  heat: 'var(--color-leaf)',
  band: 'var(--color-leaf-tint)',
  median: 'var(--color-loam)',
  target: 'var(--color-loam)',
  high: 'var(--color-ember)',
  low: 'var(--color-frost)',
  base: 'var(--color-leaf)',
  upper: 'var(--color-ember)',
  today: 'var(--color-loam)',
  event: 'var(--color-loam-soft)',
  grid: 'var(--color-line)',
  text: 'var(--color-loam-soft)',
} as const;

/** The plot area starts here in both panels, so the bolt-risk strip below can line up with it. */
export const PLOT_INSET = { left: 64, right: 12 } as const;
