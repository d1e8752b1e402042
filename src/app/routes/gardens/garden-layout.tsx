import { useEffect } from 'react';
import { NavLink, Outlet, useOutletContext, useParams } from 'react-router-dom';
import type { GardenDto } from '#shared/schemas/gardens';
import { isApiError } from '@/lib/api-client';
import { parseId } from '@/lib/ids';
import { rememberGarden } from '@/lib/last-garden';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { NotFoundMessage } from '@/components/ui/not-found-message';
import { Notice } from '@/components/ui/notice';
import { Wordmark } from '@/components/ui/wordmark';
import { useMe } from '@/features/auth/api/get-me';
import { SignOutButton } from '@/features/auth/components/sign-out-button';
import { MailboxLink } from '@/features/notifications/components/mailbox-link';
import { useGarden } from '@/features/gardens/api/get-garden';
import { GardenSwitcher } from '@/features/gardens/components/garden-switcher';
import { AlertsNavLink } from '@/features/alerts/components/alerts-nav-link';

const NAV_LINK =
  'inline-flex min-h-11 items-center border-b-4 border-transparent px-1 font-semibold hover:border-line aria-[current=page]:border-leaf';

/** Pages below the layout read the garden from here instead of fetching it again. */
export function useCurrentGarden(): GardenDto {
  return useOutletContext<GardenDto>();
}

function GardenContent({ gardenId }: { gardenId: number }) {
  const garden = useGarden(gardenId);
  const me = useMe();
  const userId = me.data?.id;
  const opened = garden.isSuccess;
  useEffect(() => {
    if (opened && userId !== undefined) rememberGarden(userId, gardenId);
  }, [opened, userId, gardenId]);
  if (garden.isPending) return <Loading label="Loading the garden…" />;
  if (garden.isError) {
    if (isApiError(garden.error, 404)) return <NotFoundMessage what="garden" />;
    return (
      <div className="flex flex-col items-start gap-3">
        <Notice tone="error" title="The garden could not be loaded" live="alert">
          {garden.error.message}
        </Notice>
        <Button variant="quiet" onClick={() => garden.refetch()}>
          Try again
        </Button>
      </div>
    );
  }
  return <Outlet context={garden.data} />;
}

export function GardenLayout() {
  const params = useParams();
  const gardenId = parseId(params.gardenId);
  const me = useMe();

  return (
    <div className="min-h-dvh">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:top-2 focus:left-2 focus:z-10 focus:rounded-md focus:bg-paper-raised focus:px-4 focus:py-2"
      >
        Skip to main content
      </a>
      <header className="border-b border-line bg-paper-sunk">
        <div className="mx-auto flex max-w-5xl flex-wrap items-center gap-x-6 gap-y-3 px-4 py-3">
          <Wordmark />
          <div className="order-3 w-full sm:order-none sm:w-auto">
            <GardenSwitcher currentId={gardenId} />
          </div>
          <div className="ml-auto flex min-w-0 items-center gap-3">
            <span className="truncate text-sm" title={me.data?.email}>
              <span className="sr-only">Signed in as </span>
              {me.data?.name}
            </span>
            <MailboxLink />
            <SignOutButton />
          </div>
        </div>
        {gardenId !== null && (
          <nav aria-label="Garden" className="mx-auto max-w-5xl px-4">
            <ul className="flex flex-wrap gap-x-6">
              <li>
                <NavLink end to={`/g/${gardenId}`} className={NAV_LINK}>
                  Today
                </NavLink>
              </li>
              <li>
                <AlertsNavLink gardenId={gardenId} className={NAV_LINK} />
              </li>
              <li>
                <NavLink to={`/g/${gardenId}/plantings`} className={NAV_LINK}>
                  Plantings
                </NavLink>
              </li>
              <li>
                <NavLink to={`/g/${gardenId}/varieties`} className={NAV_LINK}>
                  Varieties
                </NavLink>
              </li>
              <li>
                <NavLink to={`/g/${gardenId}/seed-lots`} className={NAV_LINK}>
                  Seed lots
                </NavLink>
              </li>
              <li>
                <NavLink to={`/g/${gardenId}/beds`} className={NAV_LINK}>
                  Beds
                </NavLink>
              </li>
              <li>
                <NavLink to={`/g/${gardenId}/crops`} className={NAV_LINK}>
                  Crops
                </NavLink>
              </li>
              <li>
                <NavLink to={`/g/${gardenId}/weather`} className={NAV_LINK}>
                  Weather
                </NavLink>
              </li>
              <li>
                <NavLink to={`/g/${gardenId}/settings`} className={NAV_LINK}>
                  Garden settings
                </NavLink>
              </li>
            </ul>
          </nav>
        )}
      </header>
      <main id="main" tabIndex={-1} className="mx-auto max-w-5xl px-4 py-6 focus:outline-none">
        {gardenId === null ? <NotFoundMessage what="garden" /> : <GardenContent gardenId={gardenId} />}
      </main>
    </div>
  );
}
