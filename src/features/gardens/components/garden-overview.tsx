import { Settings } from 'lucide-react';
import { Link } from 'react-router-dom';
import type { GardenDto } from '#shared/schemas/gardens';
import { ROLE_SENTENCES } from '@/lib/format';
import { Notice } from '@/components/ui/notice';
import { GardenFacts } from '@/features/gardens/components/garden-facts';
import { RoleBadge } from '@/features/gardens/components/role-badge';

export function GardenOverview({ garden }: { garden: GardenDto }) {
  const isOwner = garden.role === 'owner';
  const hasLocation = garden.latitude !== null && garden.longitude !== null;

  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-center gap-3">
        <h1 className="text-2xl font-bold break-words sm:text-3xl">{garden.name}</h1>
        <RoleBadge role={garden.role} />
      </div>
      <p className="text-loam-soft">{ROLE_SENTENCES[garden.role]}</p>

      {!hasLocation && (
        <Notice tone="info" title="No location yet">
          {isOwner
            ? 'Add the garden’s latitude and longitude in Garden settings so its temperatures can be matched to the place.'
            : 'The garden’s owner has not set its latitude and longitude yet.'}
        </Notice>
      )}

      <section aria-labelledby="garden-facts" className="rounded-lg border border-line bg-paper-raised px-4 sm:px-6">
        <h2 id="garden-facts" className="pt-4 text-lg font-bold">
          About this garden
        </h2>
        <GardenFacts garden={garden} />
      </section>

      {isOwner && (
        <p>
          <Link
            to={`/g/${garden.id}/settings`}
            className="inline-flex min-h-11 items-center gap-2 font-semibold text-frost underline"
          >
            <Settings className="size-4" aria-hidden="true" />
            Change garden settings
          </Link>
        </p>
      )}
    </div>
  );
}
