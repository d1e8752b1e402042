import { useEffect, useRef } from 'react';
import { MailCheck } from 'lucide-react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { useSignUpMail } from '@/features/auth/api/get-sign-up-mail';

/**
 * In a local copy of Heatclock mail is caught, not sent: show the caught sign-up message here so
 * the link can be followed. A server with real e-mail shows nothing (the route is not there).
 */
function LocalMailbox({ email }: { email: string }) {
  const mail = useSignUpMail(email);
  if (mail.data === null || mail.isError) return null;
  const latest = mail.data?.[0];
  const link = latest?.text.match(/\/register\/confirm\/[A-Za-z0-9_-]+/)?.[0];
  return (
    <section aria-labelledby="local-mailbox" className="rounded-md border border-dashed border-line bg-paper-sunk p-3 text-sm">
      <h3 id="local-mailbox" className="font-semibold">
        Local test mailbox
      </h3>
      <p>This copy of Heatclock catches its e-mail instead of sending it, so the message is shown here.</p>
      {!latest && <p role="status">Waiting for the message…</p>}
      {latest && (
        <div role="status" className="mt-2 flex flex-col gap-1">
          <p className="font-semibold">{latest.subject}</p>
          {link ? (
            <Link to={link} className="self-start font-semibold text-frost underline">
              Open the link in the message
            </Link>
          ) : (
            <Link to="/sign-in" className="self-start font-semibold text-frost underline">
              Sign in
            </Link>
          )}
        </div>
      )}
    </section>
  );
}

/**
 * Shown after a sign-up is sent. It reads the same whether or not the address already has an
 * account (the server answers the same too); the e-mail itself tells which it is.
 */
export function CheckEmailPanel({ email, onStartOver }: { email: string; onStartOver: () => void }) {
  const heading = useRef<HTMLHeadingElement>(null);
  // The form the grower was in is gone: bring keyboard and screen reader to what replaced it.
  useEffect(() => heading.current?.focus(), []);
  return (
    <section aria-labelledby="check-email-heading" className="flex flex-col gap-4">
      <div role="status" className="flex gap-3 rounded-md border-l-4 border-leaf bg-leaf-tint px-4 py-3">
        <MailCheck className="mt-0.5 size-5 shrink-0 text-leaf" aria-hidden="true" />
        <div>
          <h2 id="check-email-heading" ref={heading} tabIndex={-1} className="font-semibold focus:outline-none">
            Check your e-mail
          </h2>
          <p>
            We sent a message to <strong className="break-all">{email}</strong> with a link to finish creating your account and your garden.
          </p>
        </div>
      </div>
      <ul className="list-disc space-y-2 pl-5">
        <li>The link works for 24 hours, once. Open it on any device: it creates the account, signs you in and opens your new garden.</li>
        <li>If this address already has a Heatclock account, the message says so instead and shows you where to sign in.</li>
        <li>Nothing after a few minutes? Look in your spam or junk folder, or send it again: a new link replaces the old one.</li>
      </ul>
      <LocalMailbox email={email} />
      <Button variant="quiet" className="self-start" onClick={onStartOver}>
        Use a different e-mail or send again
      </Button>
    </section>
  );
}
