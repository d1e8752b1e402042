import { useState } from 'react';
import { ROLE_LABELS } from '#shared/schemas/members';
import type { InvitationDto } from '#shared/schemas/invitations';
import { formatInstant } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { Notice } from '@/components/ui/notice';
import { useInvitations } from '@/features/invitations/api/get-invitations';
import { useRevokeInvitation } from '@/features/invitations/api/revoke-invitation';
import { useInvitationTestMail } from '@/features/invitations/api/get-invitation-test-mail';
import { isApiError } from '@/lib/api-client';

/** Invitations not used yet, each with a Revoke that asks once. */
export function PendingInvitations({ gardenId, timeZone }: { gardenId: number; timeZone: string }) {
  const invitations = useInvitations(gardenId, true);
  return (
    <section aria-labelledby="pending-invitations" className="flex flex-col gap-3">
      <h2 id="pending-invitations" className="text-lg font-bold">Waiting to be accepted</h2>
      {invitations.isPending && <Loading label="Loading invitations…" />}
      {invitations.isError && <LoadProblem error={invitations.error} what="the invitations" onRetry={() => invitations.refetch()} retrying={invitations.isFetching} />}
      {invitations.data &&
        (invitations.data.items.length === 0 ? (
          <p className="text-loam-soft">No invitations are waiting.</p>
        ) : (
          <ul className="flex flex-col gap-2">
            {invitations.data.items.map((i) => (
              <PendingInvitation key={i.id} gardenId={gardenId} invitation={i} timeZone={timeZone} />
            ))}
          </ul>
        ))}
    </section>
  );
}

function PendingInvitation({ gardenId, invitation, timeZone }: { gardenId: number; invitation: InvitationDto; timeZone: string }) {
  const [asking, setAsking] = useState(false);
  const revoke = useRevokeInvitation(gardenId);
  return (
    <li className="flex flex-wrap items-start justify-between gap-2 rounded-lg border border-line bg-paper-raised p-3">
      <div className="min-w-0">
        <p className="font-semibold break-all">{invitation.email}</p>
        <p className="text-sm text-loam-soft">
          {`${ROLE_LABELS[invitation.role]} · invited by ${invitation.invitedBy} · link works until ${formatInstant(invitation.expiresAt, timeZone)}`}
        </p>
      </div>
      <TestMail gardenId={gardenId} invitationId={invitation.id} />
      {asking ? (
        <div role="group" aria-label={`Revoke the invitation to ${invitation.email}`} className="flex basis-full flex-col gap-2 rounded-md border-2 border-clay bg-clay-tint p-3">
          <p className="font-semibold">{`Revoke the invitation to ${invitation.email}?`}</p>
          <p className="text-sm">The link in their e-mail stops working. You can invite them again later.</p>
          <div className="flex flex-wrap gap-2">
            <Button variant="danger" onClick={() => revoke.mutate(invitation.id)} disabled={revoke.isPending}>
              {revoke.isPending ? 'Revoking…' : 'Revoke'}
            </Button>
            <Button variant="quiet" onClick={() => { revoke.reset(); setAsking(false); }} disabled={revoke.isPending}>
              Keep it
            </Button>
          </div>
          {revoke.error && <Notice tone="error" title="Not revoked" live="alert">{revoke.error.message}</Notice>}
        </div>
      ) : (
        <Button variant="quiet-danger" onClick={() => setAsking(true)} aria-label={`Revoke the invitation to ${invitation.email}`}>
          Revoke
        </Button>
      )}
    </li>
  );
}

/**
 * While mail only reaches the local test mailbox, someone invited at a new address has no account
 * to read it with: the owner can open the copy here and pass the link on.
 */
function TestMail({ gardenId, invitationId }: { gardenId: number; invitationId: number }) {
  const [open, setOpen] = useState(false);
  const mail = useInvitationTestMail(gardenId, invitationId, open);
  if (!open) {
    return (
      <Button variant="quiet" className="px-3 text-sm" onClick={() => setOpen(true)}>
        Show the test e-mail
      </Button>
    );
  }
  return (
    <div className="flex basis-full flex-col gap-2">
      {mail.isPending && <Loading label="Looking in the test mailbox…" />}
      {mail.isError &&
        (isApiError(mail.error, 404) ? (
          <p className="text-sm">Mail here goes to real addresses, so there is no test copy to show.</p>
        ) : (
          <LoadProblem error={mail.error} what="the test e-mail" onRetry={() => mail.refetch()} retrying={mail.isFetching} compact />
        ))}
      {mail.isSuccess &&
        (mail.data ? (
          <pre aria-label="The invitation e-mail" className="overflow-x-auto rounded-md border border-line bg-paper-sunk p-3 text-sm whitespace-pre-wrap break-all">
            {mail.data.text}
          </pre>
        ) : (
          <p className="flex flex-wrap items-center gap-2 text-sm">
            Not in the test mailbox yet: it is on its way.
            <Button variant="quiet" className="px-3 text-sm" onClick={() => void mail.refetch()} disabled={mail.isFetching}>
              Look again
            </Button>
          </p>
        ))}
    </div>
  );
}
