import { Link } from 'react-router-dom';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { Wordmark } from '@/components/ui/wordmark';
import { useMailbox } from '@/features/notifications/api/get-mailbox';
import { MailboxList } from '@/features/notifications/components/mailbox-list';

export function MailboxPage() {
  const mailbox = useMailbox();
  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-6 px-4 py-6">
      <title>Test mailbox · Heatclock</title>
      <Wordmark />
      <main id="main" className="flex flex-col gap-4">
        <h1 className="text-2xl font-bold sm:text-3xl">Test mailbox</h1>
        <p>
          This is the local test mailbox: while this copy of Heatclock sends e-mail to its built-in test server, every message is caught here
          instead of reaching anyone. It lists the latest 100 sent to you, newest first.
        </p>
        {mailbox.isPending && <Loading label="Loading messages…" />}
        {mailbox.isError &&
          (isApiError(mailbox.error, 404) ? (
            <Notice tone="info" title="No test mailbox here">
              This server sends real e-mail, so there is no local mailbox to show.
            </Notice>
          ) : (
            <LoadProblem error={mailbox.error} what="the messages" onRetry={() => mailbox.refetch()} retrying={mailbox.isFetching} />
          ))}
        {mailbox.isSuccess && (
          <>
            <Button variant="quiet" className="self-start" onClick={() => mailbox.refetch()} disabled={mailbox.isFetching}>
              {mailbox.isFetching ? 'Checking…' : 'Check for new messages'}
            </Button>
            <MailboxList messages={mailbox.data} />
          </>
        )}
        <Link to="/" className="underline">
          Back to your garden
        </Link>
      </main>
    </div>
  );
}
