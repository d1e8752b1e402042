import { useEffect, useRef, useState } from 'react';
import { MailCheck } from 'lucide-react';
import { Link } from 'react-router-dom';
import { Button } from '@/components/ui/button';
import { AuthFrame } from '@/features/auth/components/auth-frame';
import { ForgotPasswordForm } from '@/features/account/components/forgot-password-form';

const LINK = 'font-semibold text-frost underline';

/** Reads the same whether or not the address has an account, as the server's answer does. */
function LinkSent({ email, onStartOver }: { email: string; onStartOver: () => void }) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => heading.current?.focus(), []);
  return (
    <section aria-labelledby="reset-sent-heading" className="flex flex-col gap-4">
      <div role="status" className="flex gap-3 rounded-md border-l-4 border-leaf bg-leaf-tint px-4 py-3">
        <MailCheck className="mt-0.5 size-5 shrink-0 text-leaf" aria-hidden="true" />
        <div>
          <h2 id="reset-sent-heading" ref={heading} tabIndex={-1} className="font-semibold focus:outline-none">
            Check your e-mail
          </h2>
          <p>
            If an account uses <strong className="break-all">{email}</strong>, we sent it a link to choose a new password.
          </p>
        </div>
      </div>
      <ul className="list-disc space-y-2 pl-5">
        <li>The link works for 1 hour, once. Choosing a new password signs the account out on every device.</li>
        <li>Nothing after a few minutes? Look in your spam or junk folder, check the address, or ask again: a new link replaces the old one.</li>
      </ul>
      <Button variant="quiet" className="self-start" onClick={onStartOver}>
        Use a different e-mail or send again
      </Button>
    </section>
  );
}

export function ForgotPasswordPage() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  return (
    <AuthFrame title="Forgot your password?" intro="Tell us the e-mail you sign in with and we will send a link to choose a new password.">
      {sentTo ? <LinkSent email={sentTo} onStartOver={() => setSentTo(null)} /> : <ForgotPasswordForm onSent={setSentTo} />}
      <p className="mt-6 text-sm">
        Remembered it?{' '}
        <Link to="/sign-in" className={LINK}>
          Sign in
        </Link>
      </p>
    </AuthFrame>
  );
}
