import { Link, useNavigate, useParams } from 'react-router-dom';
import { isApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { AuthFrame } from '@/features/auth/components/auth-frame';
import { useConfirmRegistration } from '@/features/auth/api/confirm-registration';

const LINK = 'font-semibold text-frost underline';

/**
 * Opened from the sign-up e-mail, often on another device. A button rather than an automatic
 * request: the link is used once, and a mail program that opens links to check them must not spend it.
 */
export function RegisterConfirmPage() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const confirm = useConfirmRegistration(token);
  const error = confirm.error;
  // Refused for good (used, replaced, expired, or the address has an account): asking again cannot help.
  const refused = isApiError(error) && [400, 404, 409, 410].includes(error.status);

  const finish = () =>
    confirm.mutate(undefined, {
      // As a new sign-up always has: straight to the new garden, which asks for its location next.
      onSuccess: ({ garden }) => void navigate(`/g/${garden.id}`, { replace: true }),
    });

  return (
    <AuthFrame title="Finish creating your account" intro="One step left: this creates your account and your first garden, and signs you in.">
      <div className="flex flex-col gap-4">
        {error &&
          (refused && isApiError(error, 409) ? (
            <Notice tone="info" title="You already have an account" live="alert">
              {error.message}{' '}
              <Link to="/sign-in" className={LINK}>
                Sign in
              </Link>
            </Notice>
          ) : refused ? (
            <Notice tone="error" title="Account not created" live="alert">
              {error.message}{' '}
              <Link to="/register" className={LINK}>
                Register again
              </Link>
            </Notice>
          ) : (
            <Notice tone="error" title="Not finished yet" live="alert">
              {error.message} The link has not been used yet, so you can try again.
            </Notice>
          ))}
        {!refused && (
          <Button onClick={finish} disabled={confirm.isPending || confirm.isSuccess}>
            {confirm.isPending || confirm.isSuccess ? 'Creating your account…' : 'Finish creating my account'}
          </Button>
        )}
        <p className="text-sm">
          Already finished on another device?{' '}
          <Link to="/sign-in" className={LINK}>
            Sign in
          </Link>
        </p>
      </div>
    </AuthFrame>
  );
}
