import { Navigate } from 'react-router-dom';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Wordmark } from '@/components/ui/wordmark';
import { lastGarden } from '@/lib/last-garden';
import { useMe } from '@/features/auth/api/get-me';
import { SignOutButton } from '@/features/auth/components/sign-out-button';
import { useGardens } from '@/features/gardens/api/get-gardens';

/** `/` has no page of its own: it opens the garden last opened here, if still a member, else the first. */
export function FirstGardenPage() {
  const gardens = useGardens();
  const me = useMe();

  if (gardens.isPending) return <Loading label="Loading your gardens…" />;
  if (gardens.isSuccess && gardens.data.length > 0) {
    const last = me.data ? lastGarden(me.data.id) : null;
    const garden = gardens.data.find((g) => g.id === last) ?? gardens.data[0];
    return <Navigate to={`/g/${garden.id}`} replace />;
  }

  return (
    <div className="mx-auto flex max-w-xl flex-col items-start gap-4 px-4 py-6">
      <title>Your gardens · Heatclock</title>
      <Wordmark />
      <main className="flex w-full flex-col items-start gap-4">
        {gardens.isError ? (
          <LoadProblem error={gardens.error} what="your gardens" onRetry={() => gardens.refetch()} retrying={gardens.isFetching} />
        ) : (
          <>
            <h1 className="text-2xl font-bold">No gardens yet</h1>
            <p>You are not a member of any garden. A garden’s owner can add you as a member.</p>
          </>
        )}
        <SignOutButton />
      </main>
    </div>
  );
}
