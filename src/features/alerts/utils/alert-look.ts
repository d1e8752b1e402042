import { CloudOff, Eye, Flower2, Info, OctagonAlert, Scissors, Snowflake, ThermometerSnowflake, ThermometerSun, TriangleAlert } from 'lucide-react';
import type { AlertSeverity, AlertStatus, AlertType } from '#shared/schemas/alerts';

type Icon = typeof Info;

// Each type and severity has a word and an icon; colour only repeats them (ember heat, frost cold,
// leaf progress). Severity stays in loam, so it never reads as heat or cold.
export const TYPE_LOOK: Record<AlertType, { icon: Icon; className: string }> = {
  'bolt-risk': { icon: Flower2, className: 'border-ember bg-ember-tint text-ember' },
  'heat-stress': { icon: ThermometerSun, className: 'border-ember bg-ember-tint text-ember' },
  frost: { icon: Snowflake, className: 'border-frost bg-frost-tint text-frost' },
  chilling: { icon: ThermometerSnowflake, className: 'border-frost bg-frost-tint text-frost' },
  'harvest-window': { icon: Scissors, className: 'border-leaf bg-leaf-tint text-leaf' },
  'data-gap': { icon: CloudOff, className: 'border-line bg-paper-sunk text-loam' },
};

export const SEVERITY_LOOK: Record<AlertSeverity, { icon: Icon; className: string }> = {
  info: { icon: Info, className: 'border-line text-loam-soft' },
  watch: { icon: Eye, className: 'border-loam-soft text-loam' },
  warning: { icon: TriangleAlert, className: 'border-loam text-loam' },
  severe: { icon: OctagonAlert, className: 'border-loam bg-loam text-paper-raised' },
};

export const STATUS_WORDS: Record<AlertStatus, string> = { open: 'Open', acknowledged: 'Acknowledged', resolved: 'Resolved' };
