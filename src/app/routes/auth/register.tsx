import { useEffect, useRef, useState } from 'react';
import { Link, Navigate, useSearchParams } from 'react-router-dom';
import { safeNextPath } from '@/lib/safe-redirect';
import { PageLoading } from '@/components/ui/loading';
import { useMe } from '@/features/auth/api/get-me';
import { AuthFrame } from '@/features/auth/components/auth-frame';
import { RegisterForm } from '@/features/auth/components/register-form';
import { CheckEmailPanel } from '@/features/auth/components/check-email-panel';

export function RegisterPage() {
  const me = useMe();
  // The address the link went to, once sent; the form stays mounted (hidden) so "send again" keeps what was typed.
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [startedOver, setStartedOver] = useState(false);
  const form = useRef<HTMLDivElement>(null);
  // Back from the panel: the cursor goes to the e-mail field, the one most likely to need a change.
  useEffect(() => {
    if (startedOver && !sentTo) form.current?.querySelector<HTMLInputElement>('input[type="email"]')?.focus();
  }, [startedOver, sentTo]);
  const [params] = useSearchParams();
  const nextParam = params.get('next');

  if (me.isPending) return <PageLoading label="Checking your session…" />;
  if (me.data) return <Navigate to={safeNextPath(nextParam)} replace />;

  return (
    <AuthFrame
      title="Create an account"
      intro="Start with one garden; you can set its location and units next."
    >
      {sentTo && (
        <CheckEmailPanel
          email={sentTo}
          onStartOver={() => {
            setStartedOver(true);
            setSentTo(null);
          }}
        />
      )}
      <div ref={form} hidden={!!sentTo}>
        <RegisterForm
          onRegistered={(email) => {
            setStartedOver(false);
            setSentTo(email);
          }}
        />
      </div>
      <p className="mt-6 text-sm">
        Already have an account?{' '}
        <Link
          to={nextParam ? `/sign-in?next=${encodeURIComponent(safeNextPath(nextParam))}` : '/sign-in'}
          className="font-semibold text-frost underline"
        >
          Sign in
        </Link>
      </p>
    </AuthFrame>
  );
}
