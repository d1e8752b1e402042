import { Link, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { AuthFrame } from '@/features/auth/components/auth-frame';
import { authKeys } from '@/features/auth/api/auth-keys';
import { useConfirmEmailChange } from '@/features/account/api/confirm-email-change';

const LINK = 'font-semibold text-frost underline';

/**
 * Opened from the message sent to the new address, signed in (the page sits behind sign-in). A
 * button rather than an automatic request, so a mail program that opens links to check them cannot use it.
 */
export function ConfirmEmailPage() {
  const { token = '' } = useParams();
  const confirm = useConfirmEmailChange(token);
  const queryClient = useQueryClient();
  const error = confirm.error;
  const refused = isApiError(error) && [403, 404, 409, 410].includes(error.status);

  const use = () => confirm.mutate(undefined, { onSuccess: ({ user }) => queryClient.setQueryData(authKeys.me(), user) });

  return (
    <AuthFrame title="Confirm your new e-mail" intro="One step left: this moves your account to the new address.">
      <div className="flex flex-col gap-4">
        {confirm.isSuccess ? (
          <Notice tone="success" title="E-mail changed" live="status">
            Your account now uses <strong className="break-all">{confirm.data.user.email}</strong>. Sign in with it from now on.
          </Notice>
        ) : (
          <>
            {error && (
              <Notice tone="error" title={refused ? 'E-mail not changed' : 'Not finished yet'} live="alert">
                {error.message}
                {!refused && ' The link has not been used yet, so you can try again.'}
              </Notice>
            )}
            {!refused && (
              <Button onClick={use} disabled={confirm.isPending}>
                {confirm.isPending ? 'Changing your e-mail…' : 'Use the new e-mail'}
              </Button>
            )}
          </>
        )}
        <Link to="/account" className={`${LINK} self-start`}>
          Go to your account
        </Link>
      </div>
    </AuthFrame>
  );
}
