import { z } from 'zod';

/** GET /api/places?q= — a place name ("Hobart", "Portland, Maine", "Christchurch, NZ") or a US ZIP code. */
export const placesQuerySchema = z.object({
  q: z
    .string({ error: 'Type a place name or a US ZIP code.' })
    .trim()
    .min(2, 'Type at least 2 letters of the place, or a 5-digit US ZIP code.')
    .max(100, 'Keep the place to 100 characters or fewer.'),
});
export type PlacesQuery = z.infer<typeof placesQuerySchema>;

/** Where a match came from: a US ZIP code's centroid, or GeoNames' list of towns of 1,000 or more. */
export type PlaceSource = 'us-zip' | 'geonames';

export interface PlaceDto {
  name: string;
  /** The US state; null where the place list gives no readable region. */
  region: string | null;
  country: string;
  /** ISO 3166-1 alpha-2. */
  countryCode: string;
  /** The ZIP code asked for (ZIP matches only). */
  postalCode: string | null;
  latitude: number;
  longitude: number;
  /** IANA zone of the coordinates. */
  timeZone: string;
  source: PlaceSource;
}

export interface PlacesResponse {
  items: PlaceDto[];
}

/** Shown wherever matches are: the data's owners ask for it. */
export const PLACE_ATTRIBUTION =
  'Places from GeoNames (geonames.org, CC BY 4.0); US ZIP code centroids from the zipcodes package. Time zones from the coordinates.';
