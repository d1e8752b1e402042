import type { CapturedMailDto } from '#shared/schemas/notifications';
import { formatLocalInstant } from '@/lib/format';

/** One captured message: the plain text always, the HTML part in a sandbox that runs no scripts. */
function Message({ mail }: { mail: CapturedMailDto }) {
  return (
    <li className="rounded-lg border border-line bg-paper-raised p-4">
      <article className="flex flex-col gap-2">
        <h2 className="text-lg font-bold">{mail.subject || '(no subject)'}</h2>
        <p className="text-sm text-loam-soft">
          To {mail.to} · received <time dateTime={mail.receivedAt}>{formatLocalInstant(mail.receivedAt)}</time>
        </p>
        <details>
          <summary className="cursor-pointer font-semibold">Plain text</summary>
          <pre className="mt-2 whitespace-pre-wrap break-words text-sm">{mail.text}</pre>
        </details>
        {mail.html && (
          <details>
            <summary className="cursor-pointer font-semibold">HTML preview</summary>
            {/* An empty sandbox: no scripts, no forms, no navigation of this page. */}
            <iframe title={`HTML preview: ${mail.subject}`} sandbox="" srcDoc={mail.html} referrerPolicy="no-referrer" className="mt-2 h-96 w-full rounded border border-line bg-white" />
          </details>
        )}
      </article>
    </li>
  );
}

export function MailboxList({ messages }: { messages: CapturedMailDto[] }) {
  if (!messages.length) return <p>No messages yet. Alert e-mail and daily summaries appear here once they are sent.</p>;
  return (
    <ol className="flex flex-col gap-4" aria-label="Messages, newest first">
      {messages.map((m, i) => (
        <Message key={`${m.receivedAt}-${i}`} mail={m} />
      ))}
    </ol>
  );
}
