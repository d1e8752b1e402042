import { useEffect, useRef } from 'react';
import { MailCheck } from 'lucide-react';
import { Button } from '@/components/ui/button';

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
      <Button variant="quiet" className="self-start" onClick={onStartOver}>
        Use a different e-mail or send again
      </Button>
    </section>
  );
}
