import { CloudSun, RadioTower, Spline, Thermometer } from 'lucide-react';
import type { WeatherDayDto } from '#shared/schemas/weather';
import { SOURCE_WORDS } from '@/lib/format';

type Source = WeatherDayDto['source'];

export const SOURCE_ICONS = { observed: Thermometer, forecast: CloudSun, imported: RadioTower, filled: Spline } as const;

/** A day's provenance as a word with an icon beside it, never by colour alone. */
export function SourceLabel({ source }: { source: Source }) {
  const Icon = SOURCE_ICONS[source];
  return (
    <span className="inline-flex items-start gap-1.5 sm:whitespace-nowrap">
      <Icon className="mt-0.5 size-4 shrink-0 text-loam-soft" aria-hidden="true" />
      {SOURCE_WORDS[source]}
    </span>
  );
}
