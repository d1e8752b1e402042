import { useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { isApiError } from '@/lib/api-client';
import type { ApiError } from '@/lib/api-client';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { AuthFrame } from '@/features/auth/components/auth-frame';
import { authKeys } from '@/features/auth/api/auth-keys';
import { useResetLink } from '@/features/account/api/check-reset-link';
import { NewPasswordForm } from '@/features/account/components/new-password-form';

const LINK = 'font-semibold text-frost underline';

function Refused({ error }: { error: ApiError }) {
  return (
    <div className="flex flex-col gap-4">
      <Notice tone="error" title={isApiError(error, 410) ? 'This link can no longer be used' : 'This link does not work'} live="alert">
        {error.message}
      </Notice>
      <p className="text-sm">
        <Link to="/forgot-password" className={LINK}>
          Send me a new link
        </Link>{' '}
        or{' '}
        <Link to="/sign-in" className={LINK}>
          sign in
        </Link>
      </p>
    </div>
  );
}

/** Opened from the reset e-mail, usually signed out; the link is checked before a password is typed. */
export function ResetPasswordPage() {
  const { token = '' } = useParams();
  const [done, setDone] = useState(false);
  const link = useResetLink(token, !done);
  const queryClient = useQueryClient();
  const [refused, setRefused] = useState<ApiError | null>(null);
  const refusal = refused ?? (isApiError(link.error) && [404, 410].includes(link.error.status) ? link.error : null);

  const onDone = () => {
    // First, so the link (now used) is not asked about again once the queries are cleared.
    setDone(true);
    // Every session of the account ended with the change, this browser's too if it was signed in.
    queryClient.removeQueries();
    queryClient.setQueryData(authKeys.me(), null);
  };

  return (
    <AuthFrame title="Choose a new password" intro="Pick a new password for your Heatclock account.">
      {done ? (
        <div className="flex flex-col gap-4">
          <Notice tone="success" title="Password changed" live="status">
            Your password is changed and your account is signed out on every device.
          </Notice>
          <Link to="/sign-in" className={`${LINK} self-start`}>
            Sign in with the new password
          </Link>
        </div>
      ) : refusal ? (
        <Refused error={refusal} />
      ) : link.isPending ? (
        <Loading label="Checking the link…" />
      ) : link.isError ? (
        <LoadProblem error={link.error} what="the link" onRetry={() => link.refetch()} retrying={link.isFetching} />
      ) : (
        <NewPasswordForm token={token} onDone={onDone} onRefused={setRefused} />
      )}
    </AuthFrame>
  );
}
