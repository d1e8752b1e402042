import { useId } from 'react';
import { useLocation, useNavigate } from 'react-router-dom';
import { ROLE_WORDS } from '@/lib/format';
import { useGardens } from '@/features/gardens/api/get-gardens';

const SELECT =
  'min-h-10 w-full min-w-0 rounded-md border border-line bg-paper-raised px-2 py-1.5 text-loam sm:w-auto sm:max-w-xs';

/** Switching garden keeps the grower on the same kind of page (overview stays overview). */
export function GardenSwitcher({ currentId }: { currentId: number | null }) {
  const id = useId();
  const gardens = useGardens();
  const navigate = useNavigate();
  const location = useLocation();
  const samePage = location.pathname.replace(/^\/g\/[^/]+/, '');

  const isMember = gardens.data?.some((garden) => garden.id === currentId) ?? false;

  return (
    <div className="flex min-w-0 items-center gap-2">
      <label htmlFor={id} className="shrink-0 text-sm font-semibold">
        Garden
      </label>
      {/* One select element throughout, so focus and references survive the list arriving. */}
      <select
        id={id}
        className={SELECT}
        disabled={!gardens.isSuccess}
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
            {`${garden.name} (${ROLE_WORDS[garden.role]})`}
          </option>
        ))}
      </select>
    </div>
  );
}
