import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { useUnsubscribeInfo } from '@/features/notifications/api/get-unsubscribe';
import { useUnsubscribe } from '@/features/notifications/api/unsubscribe';

/** What an unsubscribe link is for, and the one button that uses it. Needs no sign-in. */
export function UnsubscribePanel({ token }: { token: string }) {
  const info = useUnsubscribeInfo(token);
  const stop = useUnsubscribe(token);
  if (info.isPending) return <Loading label="Checking the link…" />;
  // No answer, or the server too busy: the link may well work; say so and offer to ask again.
  if (info.isError && !(isApiError(info.error) && info.error.status >= 400 && info.error.status < 500 && info.error.status !== 429)) {
    return <LoadProblem error={info.error} what="this link" onRetry={() => info.refetch()} retrying={info.isFetching} />;
  }
  if (info.isError) {
    const used = isApiError(info.error, 410);
    return (
      <Notice tone={used ? 'info' : 'error'} title={used ? 'This link has been used' : 'This link does not work'}>
        {info.error.message}
      </Notice>
    );
  }
  const { gardenName, memberName, maskedEmail, delivery } = info.data;
  if (stop.isSuccess || delivery === 'off') {
    return (
      <Notice tone="success" title="E-mail stopped" live="status">
        {memberName} ({maskedEmail}) gets no more e-mail from {gardenName}. Sign in and open the garden’s settings to turn it on again.
      </Notice>
    );
  }
  return (
    <div className="flex flex-col items-start gap-4">
      <p>
        Stop all Heatclock e-mail from <strong>{gardenName}</strong> to {memberName} ({maskedEmail})? Other gardens are not affected.
      </p>
      {stop.isError && (
        <Notice tone="error" title="Not stopped" live="alert">
          {stop.error.message}
        </Notice>
      )}
      <Button onClick={() => stop.mutate()} disabled={stop.isPending}>
        {stop.isPending ? 'Stopping…' : `Stop e-mail from ${gardenName}`}
      </Button>
    </div>
  );
}
