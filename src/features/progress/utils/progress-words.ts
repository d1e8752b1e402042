import { CloudOff, OctagonAlert, Scissors, Snowflake, Sun, Thermometer, ThermometerSnowflake, ThermometerSun, TriangleAlert } from 'lucide-react';
import type { StartEventKind, StressDto, TodayActionKind } from '#shared/schemas/progress';

export const START_WORDS: Record<StartEventKind, string> = {
  sowing: 'sowing',
  transplant: 'transplanting',
  'planned-sowing': 'the planned sowing',
  'planned-transplant': 'the planned transplanting',
};

// Each kind of stress and action has a word and an icon; colour only repeats them.
export const STRESS_LOOK: Record<StressDto['kind'], { words: string; icon: typeof Sun }> = {
  frost: { words: 'Frost', icon: Snowflake },
  chilling: { words: 'Chilling', icon: ThermometerSnowflake },
  'blossom-drop': { words: 'Blossom drop', icon: ThermometerSun },
  'pollination-heat': { words: 'Pollination heat', icon: Sun },
};

export const SEVERITY_WORDS: Record<StressDto['severity'], string> = {
  possible: 'possible',
  light: 'light',
  moderate: 'moderate',
  severe: 'severe',
  watch: 'watch',
  warning: 'warning',
};

export const ACTION_LOOK: Record<TodayActionKind, { words: string; icon: typeof Sun; className: string }> = {
  'bolt-high': { words: 'Bolt risk high', icon: OctagonAlert, className: 'border-ember bg-ember-tint text-ember' },
  'bolt-elevated': { words: 'Bolt risk elevated', icon: TriangleAlert, className: 'border-ember bg-paper-raised text-ember' },
  // Stress may be heat or frost, so it takes neither the ember nor the frost colour.
  stress: { words: 'Weather stress', icon: Thermometer, className: 'border-loam-soft bg-paper-sunk text-loam' },
  'window-open': { words: 'Harvest window open', icon: Scissors, className: 'border-leaf bg-leaf-tint text-leaf' },
  'data-gap': { words: 'Weather missing', icon: CloudOff, className: 'border-loam-soft bg-paper-sunk text-loam' },
};

/** Bolt-high first, then stress, then open harvest windows; the server's order within a kind. */
export const ACTION_ORDER: TodayActionKind[] = ['bolt-high', 'stress', 'bolt-elevated', 'window-open', 'data-gap'];
