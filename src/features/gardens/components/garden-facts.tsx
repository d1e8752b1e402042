import type { ReactNode } from 'react';
import { Clock, Globe, MapPin, Mountain, Tag, Thermometer } from 'lucide-react';
import type { GardenDto } from '#shared/schemas/gardens';
import { formatElevation, formatLocation, HEMISPHERE_SENTENCES, UNIT_WORDS } from '@/lib/format';

function Fact({ icon: Icon, term, children }: { icon: typeof MapPin; term: string; children: ReactNode }) {
  return (
    // dt and dd sit right inside the div that is right inside the dl, so each label stays paired
    // with its value for screen readers; the icon is drawn in the label's margin.
    <div className="relative min-w-0 py-3 pl-8">
      <dt className="text-sm font-semibold text-loam-soft">
        <Icon className="absolute top-3.5 left-0 size-5 text-loam-soft" aria-hidden="true" />
        {term}
      </dt>
      <dd className="break-words">{children}</dd>
    </div>
  );
}

const NOT_SET = <span className="italic text-loam-soft">Not set</span>;

/** The garden's settings as plain facts; used wherever they are shown but not edited. */
export function GardenFacts({ garden, showName = false }: { garden: GardenDto; showName?: boolean }) {
  const location = formatLocation(garden);
  const elevation = formatElevation(garden.elevationM, garden.units);
  const hemisphere = location ? HEMISPHERE_SENTENCES[garden.hemisphere] : null;

  return (
    <dl className="divide-y divide-line">
      {showName && (
        <Fact icon={Tag} term="Garden name">
          {garden.name}
        </Fact>
      )}
      <Fact icon={MapPin} term="Location (latitude, longitude)">
        {location ?? NOT_SET}
      </Fact>
      <Fact icon={Mountain} term="Elevation">
        {elevation ?? NOT_SET}
      </Fact>
      <Fact icon={Clock} term="Time zone">
        {garden.timeZone}
      </Fact>
      <Fact icon={Thermometer} term="Display units">
        {UNIT_WORDS[garden.units]}
      </Fact>
      <Fact icon={Globe} term="Hemisphere">
        {hemisphere ?? <span className="italic text-loam-soft">Known once a location is set</span>}
      </Fact>
    </dl>
  );
}
