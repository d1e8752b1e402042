import { useEffect } from 'react';
import { Outlet, useOutletContext, useParams } from 'react-router-dom';
import type { GardenDto } from '#shared/schemas/gardens';
import { isApiError } from '@/lib/api-client';
import { parseId } from '@/lib/ids';
import { rememberGarden } from '@/lib/last-garden';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { NotFoundMessage } from '@/components/ui/not-found-message';
import { Wordmark } from '@/components/ui/wordmark';
import { useMe } from '@/features/auth/api/get-me';
import { SignOutButton } from '@/features/auth/components/sign-out-button';
import { MailboxLink } from '@/features/notifications/components/mailbox-link';
import { AccountLink } from '@/features/account/components/account-link';
import { useGarden } from '@/features/gardens/api/get-garden';
import { GardenSwitcher } from '@/features/gardens/components/garden-switcher';
import { GardenNav } from '@/app/routes/gardens/garden-nav';
import { OfflineStatus } from '@/features/offline/components/offline-status';

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
    return <LoadProblem error={garden.error} what="the garden" onRetry={() => garden.refetch()} retrying={garden.isFetching} />;
  }
  return <Outlet context={garden.data} />;
}

/**
 * Below 768 px: a one-row top bar pinned to the top (mark, garden) and the pages in a tab bar
 * pinned to the bottom, the account inside its "More". From 768 px: the header with every page.
 */
export function GardenLayout() {
  const params = useParams();
  const gardenId = parseId(params.gardenId);
  const me = useMe();
  const hasNav = gardenId !== null;

  return (
    <div className="min-h-dvh">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:z-40 focus:rounded-md focus:bg-paper-raised focus:px-4 focus:py-2"
      >
        Skip to main content
      </a>
      <header className="sticky top-0 z-30 border-b border-line bg-paper-sunk md:static">
        <div className="mx-auto flex max-w-5xl items-center gap-3 px-4 py-2 md:flex-wrap md:gap-x-5 md:py-3 lg:gap-x-6">
          <Wordmark compact />
          <div className="min-w-0 flex-1 md:flex-none">
            <GardenSwitcher currentId={gardenId} />
          </div>
          {/* On a phone the account sits in the tab bar's "More"; without a garden there is no tab bar. */}
          <div className={`ml-auto min-w-0 items-center gap-3 ${hasNav ? 'hidden md:flex' : 'flex'}`}>
            <span className="hidden truncate text-sm lg:inline" title={me.data?.email}>
              <span className="sr-only">Signed in as </span>
              {me.data?.name}
            </span>
            <AccountLink />
            <MailboxLink />
            <SignOutButton />
          </div>
        </div>
        {hasNav && <GardenNav gardenId={gardenId} userName={me.data?.name} />}
      </header>
      <OfflineStatus userId={me.data?.id ?? null} />
      {/* Room at the bottom on a phone so the tab bar never covers the end of a page. */}
      <main
        id="main"
        tabIndex={-1}
        className={`mx-auto max-w-5xl px-4 pt-6 focus:outline-none md:pb-6 ${hasNav ? 'pb-[calc(6rem+env(safe-area-inset-bottom))]' : 'pb-6'}`}
      >
        {hasNav ? <GardenContent gardenId={gardenId} /> : <NotFoundMessage what="garden" />}
      </main>
    </div>
  );
}
