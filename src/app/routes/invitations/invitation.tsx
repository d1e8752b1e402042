import { Link, useNavigate, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { A_ROLE, ROLE_LABELS, ROLE_MEANINGS } from '#shared/schemas/members';
import { isApiError } from '@/lib/api-client';
import { mutationProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { AuthFrame } from '@/features/auth/components/auth-frame';
import { SignOutButton } from '@/features/auth/components/sign-out-button';
import { authKeys } from '@/features/auth/api/auth-keys';
import { useMe } from '@/features/auth/api/get-me';
import { gardenKeys } from '@/features/gardens/api/garden-keys';
import { useAcceptInvitation } from '@/features/invitations/api/accept-invitation';
import type { AcceptedDto } from '@/features/invitations/api/accept-invitation';
import { useInvitationPreview } from '@/features/invitations/api/get-invitation-preview';
import { NewAccountForm } from '@/features/invitations/components/new-account-form';

const LINK = 'font-semibold text-frost underline';

const REFUSED_TITLES: Record<string, string> = {
  invitation_used: 'This invitation has been used',
  invitation_revoked: 'This invitation was withdrawn',
  invitation_expired: 'This invitation has expired',
  invitation_unknown: 'This invitation link does not work',
};

/**
 * Opened from the invitation e-mail, often on a device that is not signed in. Joining is a
 * button, never automatic: the link works once, and a mail program that opens links to check
 * them must not spend it.
 */
export function InvitationPage() {
  const { token = '' } = useParams();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const preview = useInvitationPreview(token);
  const me = useMe();

  const accepted = async ({ user, garden }: AcceptedDto) => {
    if (me.data?.id !== user.id) {
      // A new account is signed in on this device now, whoever was before.
      queryClient.removeQueries();
      queryClient.setQueryData(authKeys.me(), user);
    } else {
      await queryClient.invalidateQueries({ queryKey: gardenKeys.list() });
    }
    await navigate(`/g/${garden.id}`, { replace: true });
  };
  const accept = useAcceptInvitation(token, accepted);

  if (preview.isPending || me.isPending) {
    return (
      <AuthFrame title="Invitation" intro="Opening your invitation…">
        <Loading label="Loading the invitation…" />
      </AuthFrame>
    );
  }
  if (preview.isError) {
    const error = preview.error;
    const refused = isApiError(error, 404) || isApiError(error, 410);
    return (
      <AuthFrame title="Invitation" intro="Invitations to a garden come by e-mail from its owner.">
        {refused ? (
          <div className="flex flex-col gap-4">
            <Notice tone="error" title={REFUSED_TITLES[error.code] ?? 'This invitation cannot be used'} live="alert">
              {error.message}
            </Notice>
            <p>
              <Link to={me.data ? '/' : '/sign-in'} className={LINK}>
                {me.data ? 'Open your gardens' : 'Sign in'}
              </Link>
            </p>
          </div>
        ) : (
          <LoadProblem error={error} what="the invitation" onRetry={() => preview.refetch()} retrying={preview.isFetching} />
        )}
      </AuthFrame>
    );
  }

  const inv = preview.data;
  // From the session this page holds now: signing in on another tab changes it without a new preview.
  const signedInMatches = !!me.data && me.data.email.toLowerCase() === inv.email;
  const role = ROLE_LABELS[inv.role].toLowerCase();
  const signInHref = `/sign-in?next=${encodeURIComponent(`/invitations/${token}`)}`;
  return (
    <AuthFrame title={`Join “${inv.garden.name}”`} intro={`${inv.invitedBy} invited ${inv.email} to this garden.`}>
      <div className="flex flex-col gap-4">
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
          <dt className="font-semibold">Garden</dt>
          <dd>{inv.garden.name}</dd>
          <dt className="font-semibold">Your role</dt>
          <dd>{`${ROLE_LABELS[inv.role]}: ${A_ROLE[inv.role]} ${ROLE_MEANINGS[inv.role]}`}</dd>
          <dt className="font-semibold">Invited by</dt>
          <dd>{inv.invitedBy}</dd>
        </dl>
        {signedInMatches ? (
          <>
            {accept.error && (
              <Notice tone="error" title="Not joined yet" live="alert">{mutationProblem(accept.error)}</Notice>
            )}
            <Button onClick={() => accept.mutate(null)} disabled={accept.isPending || accept.isSuccess}>
              {accept.isPending || accept.isSuccess ? 'Joining…' : `Join as ${role}`}
            </Button>
          </>
        ) : !inv.accountExists ? (
          <NewAccountForm email={inv.email} onSubmit={(account) => accept.mutateAsync(account)} />
        ) : me.data ? (
          <div className="flex flex-col gap-3">
            <Notice tone="info" title="Signed in as someone else">
              {`This invitation is for ${inv.email}, but you are signed in as ${me.data.email}. Sign out, then sign in as ${inv.email} and open the link again.`}
            </Notice>
            <SignOutButton />
          </div>
        ) : (
          <div className="flex flex-col gap-3">
            <p>{`${inv.email} already has a Heatclock account. Sign in first, then join.`}</p>
            <Link to={signInHref} className={`${LINK} self-start`}>
              Sign in first
            </Link>
          </div>
        )}
      </div>
    </AuthFrame>
  );
}
