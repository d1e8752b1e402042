import { MailWarning } from 'lucide-react';
import { LoadProblem } from '@/components/ui/load-problem';
import { useFailedMail } from '@/features/notifications/api/get-failed-mail';

/** For owners: alert e-mails that never arrived, so a mistyped address can be put right. */
export function FailedMailSection({ gardenId }: { gardenId: number }) {
  const failed = useFailedMail(gardenId);
  return (
    <section aria-labelledby="failed-mail" className="flex flex-col gap-2 rounded-lg border border-line bg-paper-raised p-4 sm:p-6">
      <h2 id="failed-mail" className="text-lg font-bold">
        E-mail that could not be delivered
      </h2>
      {failed.isPending && <p>Checking…</p>}
      {failed.isError && <LoadProblem compact error={failed.error} what="the list of undelivered e-mail" onRetry={() => failed.refetch()} retrying={failed.isFetching} />}
      {failed.data && failed.data.length === 0 && <p>Every alert e-mail of this garden has been delivered or is on its way.</p>}
      {failed.data && failed.data.length > 0 && (
        <ul className="flex flex-col gap-2">
          {failed.data.map((m) => (
            <li key={m.id} className="flex gap-2">
              <MailWarning className="mt-0.5 size-5 shrink-0 text-clay" aria-hidden="true" />
              <span>
                <strong>{m.to}</strong>: “{m.subject}”, given up after {m.attempts} {m.attempts === 1 ? 'try' : 'tries'}
                {m.lastError ? ` (the mail server said: ${m.lastError})` : ''}.
              </span>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
