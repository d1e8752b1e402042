import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { isApiError } from '@/lib/api-client';
import { signInPathFor } from '@/lib/safe-redirect';
import { PageLoading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { authKeys } from '@/features/auth/api/auth-keys';
import { useMe } from '@/features/auth/api/get-me';

/**
 * A session that expires mid-visit shows up as a 401 on whatever query runs next; treating it as
 * signed out sends the grower to sign in and then back to the page they were on.
 */
function useSignedOutOnExpiredSession() {
  const queryClient = useQueryClient();
  useEffect(
    () =>
      queryClient.getQueryCache().subscribe((event) => {
        if (event.type === 'updated' && event.action.type === 'error' && isApiError(event.action.error, 401)) {
          queryClient.setQueryData(authKeys.me(), null);
        }
      }),
    [queryClient],
  );
}

/** Guards every signed-in page; a signed-out visitor is sent to sign in and brought back after. */
export function RequireAuth() {
  const me = useMe();
  const location = useLocation();
  useSignedOutOnExpiredSession();

  if (me.isPending) return <PageLoading label="Checking your session…" />;
  if (me.isError) {
    return (
      <div className="mx-auto max-w-xl p-6">
        <LoadProblem error={me.error} what="your session" onRetry={() => me.refetch()} retrying={me.isFetching} />
      </div>
    );
  }
  if (!me.data) return <Navigate to={signInPathFor(location)} replace />;
  return <Outlet />;
}
