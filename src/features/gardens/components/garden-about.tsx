import { Settings } from 'lucide-react';
import { Link } from 'react-router-dom';
import type { GardenDto } from '#shared/schemas/gardens';
import { ROLE_SENTENCES } from '@/lib/format';
import { Notice } from '@/components/ui/notice';
import { GardenFacts } from '@/features/gardens/components/garden-facts';
import { RoleBadge } from '@/features/gardens/components/role-badge';

export const hasLocation = (garden: GardenDto) => garden.latitude !== null && garden.longitude !== null;

/** Without a location there is no weather, so no degree days: said first, on the garden's landing page. */
export function NoLocationNotice({ garden }: { garden: GardenDto }) {
  return (
    <Notice tone="info" title="No location yet">
      {garden.role === 'owner'
        ? 'In Garden settings, find the garden by town or US ZIP code (or type its latitude and longitude) so its temperatures can be matched to the place.'
        : 'The garden’s owner has not set its latitude and longitude yet.'}
    </Notice>
  );
}

/** The garden's own facts and the member's role, at the foot of Today. */
export function GardenAbout({ garden }: { garden: GardenDto }) {
  return (
    <section aria-labelledby="garden-about" className="rounded-lg border border-line bg-paper-raised px-4 sm:px-6">
      <div className="flex flex-wrap items-center gap-3 pt-4">
        <h2 id="garden-about" className="text-lg font-bold">
          About this garden
        </h2>
        <RoleBadge role={garden.role} />
      </div>
      <p className="pt-2 text-loam-soft">{ROLE_SENTENCES[garden.role]}</p>
      <GardenFacts garden={garden} />
      {garden.role === 'owner' && (
        <p className="pb-3">
          <Link to={`/g/${garden.id}/settings`} className="inline-flex min-h-11 items-center gap-2 font-semibold text-frost underline">
            <Settings className="size-4" aria-hidden="true" />
            Change garden settings
          </Link>
        </p>
      )}
    </section>
  );
}
