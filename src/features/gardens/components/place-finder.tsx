import { useId, useState } from 'react';
import type { KeyboardEvent } from 'react';
import { MapPin, Search } from 'lucide-react';
import { PLACE_ATTRIBUTION, placesQuerySchema } from '#shared/schemas/places';
import type { PlaceDto } from '#shared/schemas/places';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FieldError } from '@/components/ui/text-field';
import { ApiError } from '@/lib/api-client';
import { formatLatitude, formatLongitude } from '@/lib/format';
import { mutationProblem } from '@/lib/problems';
import { usePlaces } from '@/features/gardens/api/find-places';

/** "Hobart, Australia" · "Portland, Maine, United States" · "New York, New York, United States (ZIP 10001)". */
export function placeLabel(p: PlaceDto): string {
  const where = [p.name, p.region, p.country].filter(Boolean).join(', ');
  return p.postalCode ? `${where} (ZIP ${p.postalCode})` : where;
}

const CONTROL = 'min-h-11 w-full rounded-md border border-line bg-paper-raised px-3 py-2 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-loam';

/**
 * Finds the garden by town or US ZIP code, from lists kept on the server (no outside service), and
 * hands the chosen match to the form: the grower sees the numbers it fills in and can still edit
 * them. A part of the settings form, not a form of its own (forms do not nest), so Enter in the
 * search box searches instead of saving the settings.
 */
export function PlaceFinder({ onChoose }: { onChoose: (place: PlaceDto) => void }) {
  const id = useId();
  const [text, setText] = useState('');
  const [asked, setAsked] = useState<string | null>(null);
  const [typing, setTyping] = useState<string | null>(null);
  const places = usePlaces(asked);

  const find = () => {
    const parsed = placesQuerySchema.safeParse({ q: text });
    if (!parsed.success) {
      setTyping(parsed.error.issues[0]?.message ?? 'Type a place name or a US ZIP code.');
      return;
    }
    setTyping(null);
    // The same words again after a failure: ask again (an answer is kept for good once it came).
    if (parsed.data.q === asked && places.isError) void places.refetch();
    else setAsked(parsed.data.q);
  };
  const onKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    if (e.key !== 'Enter') return;
    e.preventDefault();
    find();
  };
  const serverField = places.error instanceof ApiError ? places.error.fields.q : undefined;
  const fieldError = typing ?? serverField;
  const items = places.data?.items;

  return (
    <div className="flex flex-col gap-3 rounded-lg border border-line bg-paper px-4 py-4">
      <div className="flex flex-col gap-1">
        <label htmlFor={`${id}-q`} className="font-semibold">
          Find the garden by town or US ZIP code
        </label>
        <p id={`${id}-hint`} className="text-sm text-loam-soft">
          For example “Hobart”, “Portland, Maine” or “10001”. It fills in the latitude, longitude and time zone below for you to check.
        </p>
        <div className="flex flex-wrap items-start gap-2">
          <input
            id={`${id}-q`}
            type="search"
            autoComplete="off"
            enterKeyHint="search"
            value={text}
            onChange={(e) => setText(e.target.value)}
            onKeyDown={onKeyDown}
            aria-invalid={fieldError ? true : undefined}
            aria-describedby={[`${id}-hint`, fieldError ? `${id}-error` : null].filter(Boolean).join(' ')}
            className={`${CONTROL} max-w-md flex-1`}
          />
          <Button type="button" variant="quiet" onClick={find} disabled={places.isFetching}>
            <Search className="size-4" aria-hidden="true" />
            {places.isFetching ? 'Finding…' : 'Find'}
          </Button>
        </div>
        {fieldError && <FieldError id={`${id}-error`}>{fieldError}</FieldError>}
      </div>

      {places.isError && !serverField && (
        <Notice tone="error" title="Places could not be looked up" live="alert">
          {mutationProblem(places.error, 'you can still type the coordinates below')}
        </Notice>
      )}
      {items && items.length === 0 && (
        <p role="status" className="text-sm">
          No town or ZIP code matches “{asked}”. Try the nearest larger town, add the state or country after a comma, or type the coordinates below.
        </p>
      )}
      {items && items.length > 0 && (
        <div className="flex flex-col gap-2">
          <p role="status" className="text-sm font-semibold">
            {items.length === 1 ? '1 match' : `${items.length} matches, the likeliest first`}: choose yours.
          </p>
          <ul className="flex flex-col divide-y divide-line rounded-md border border-line bg-paper-raised">
            {items.map((p, i) => (
              <li key={`${i}-${p.latitude}-${p.longitude}`} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2">
                <span className="flex flex-col">
                  <span className="font-semibold">{placeLabel(p)}</span>
                  <span className="text-sm text-loam-soft">
                    {formatLatitude(p.latitude)}, {formatLongitude(p.longitude)} · {p.timeZone}
                  </span>
                </span>
                <Button type="button" variant="quiet" onClick={() => onChoose(p)} aria-label={`Use ${placeLabel(p)}`}>
                  <MapPin className="size-4" aria-hidden="true" />
                  Use this place
                </Button>
              </li>
            ))}
          </ul>
        </div>
      )}
      <p className="text-xs text-loam-soft">{PLACE_ATTRIBUTION}</p>
    </div>
  );
}
