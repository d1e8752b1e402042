import { useId } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import { ROLE_WORDS } from '@/lib/format';
import { useGardens } from '@/features/gardens/api/get-gardens';

const SELECT =
  'min-h-11 w-full min-w-0 truncate rounded-md border border-line bg-paper-raised px-2 py-1.5 text-loam md:w-auto md:max-w-56 lg:max-w-xs';

const gardenWords = (garden: { name: string; role: keyof typeof ROLE_WORDS }) => `${garden.name} (${ROLE_WORDS[garden.role]})`;

/** Switching garden keeps the grower on the same kind of page (overview stays overview). */
export function GardenSwitcher({ currentId }: { currentId: number | null }) {
  const id = useId();
  const gardens = useGardens();
  const navigate = useNavigate();
  const location = useLocation();
  const samePage = location.pathname.replace(/^\/g\/[^/]+/, '');

  const current = gardens.data?.find((garden) => garden.id === currentId);
  const isMember = current !== undefined;

  return (
    <div className="flex min-w-0 items-center gap-2">
      {/* On a phone the chosen garden's name needs the room; the label is still read out. */}
      <label htmlFor={id} className="sr-only shrink-0 text-sm font-semibold md:not-sr-only">
        Garden
      </label>
      {/* One select element throughout, so focus and references survive the list arriving. */}
      <select
        id={id}
        className={SELECT}
        disabled={!gardens.isSuccess}
        // A long name is cut short on a phone; the whole of it shows on hover and in the picker.
        title={current ? gardenWords(current) : undefined}
        value={isMember ? String(currentId) : ''}
        onChange={(event) => navigate(`/g/${event.target.value}${samePage}`)}
      >
        {gardens.isPending && <option value="">Loading gardens…</option>}
        {gardens.isError && <option value="">Gardens could not be loaded</option>}
        {gardens.isSuccess && !isMember && (
          <option value="" disabled>
            Choose a garden
          </option>
        )}
        {gardens.data?.map((garden) => (
          <option key={garden.id} value={garden.id}>
            {gardenWords(garden)}
          </option>
        ))}
      </select>
    </div>
  );
}
