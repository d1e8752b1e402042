import { Laptop } from 'lucide-react';
import type { AccountSessionDto } from '#shared/schemas/account';
import { formatLocalInstant } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { useSessions } from '@/features/account/api/get-sessions';
import { useEndOtherSessions, useEndSession } from '@/features/account/api/end-sessions';

function SessionRow({ session }: { session: AccountSessionDto }) {
  const end = useEndSession();
  return (
    <li className="flex flex-wrap items-center gap-x-4 gap-y-2 border-b border-line py-3 last:border-b-0">
      <Laptop className="size-5 shrink-0 text-loam-soft" aria-hidden="true" />
      <div className="min-w-0 flex-1">
        <p className="font-semibold">
          {session.device}
          {session.current && <span className="ml-2 rounded-sm bg-leaf-tint px-2 py-0.5 text-sm font-semibold text-leaf">This device</span>}
        </p>
        <p className="text-sm text-loam-soft">
          {session.current ? 'In use now' : session.lastSeenAt ? `Last active ${formatLocalInstant(session.lastSeenAt)}` : 'Last active: not known'}
          {session.signedInAt && ` · signed in ${formatLocalInstant(session.signedInAt)}`}
        </p>
        {end.isError && (
          <p role="alert" className="text-sm text-clay">
            Not signed out: {end.error.message}
          </p>
        )}
      </div>
      {!session.current && (
        <Button variant="quiet" className="px-3 text-sm" disabled={end.isPending} onClick={() => end.mutate(session.id)} aria-label={`Sign out ${session.device}`}>
          {end.isPending ? 'Signing out…' : 'Sign out'}
        </Button>
      )}
    </li>
  );
}

/** Where the account is signed in, this device first; any other can be signed out from here. */
export function SessionsSection() {
  const sessions = useSessions();
  const endOthers = useEndOtherSessions();
  if (sessions.isPending) return <Loading label="Loading your devices…" />;
  if (sessions.isError) return <LoadProblem error={sessions.error} what="your signed-in devices" onRetry={() => sessions.refetch()} retrying={sessions.isFetching} />;
  const others = sessions.data.filter((s) => !s.current).length;
  return (
    <div className="flex flex-col gap-3">
      <ul aria-label="Signed-in devices">
        {sessions.data.map((s) => (
          <SessionRow key={s.id} session={s} />
        ))}
      </ul>
      {endOthers.isSuccess && (
        <Notice tone="success" title="Signed out everywhere else" live="status">
          Only this device is signed in now.
        </Notice>
      )}
      {endOthers.isError && (
        <Notice tone="error" title="Not signed out" live="alert">
          {endOthers.error.message}
        </Notice>
      )}
      {others > 0 ? (
        <Button variant="quiet" className="self-start" disabled={endOthers.isPending} onClick={() => endOthers.mutate()}>
          {endOthers.isPending ? 'Signing out…' : 'Sign out everywhere else'}
        </Button>
      ) : (
        !endOthers.isSuccess && <p className="text-sm text-loam-soft">No other device is signed in.</p>
      )}
    </div>
  );
}
