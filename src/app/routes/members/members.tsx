import { Link, useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import type { GardenDto } from '#shared/schemas/gardens';
import { A_ROLE, ROLE_MEANINGS } from '#shared/schemas/members';
import { Loading } from '@/components/ui/loading';
import { LoadProblem } from '@/components/ui/load-problem';
import { useCurrentGarden } from '@/app/routes/gardens/garden-layout';
import { useMe } from '@/features/auth/api/get-me';
import { gardenKeys } from '@/features/gardens/api/garden-keys';
import { useMembers } from '@/features/members/api/get-members';
import { MemberTable } from '@/features/members/components/member-table';
import { LeaveGarden } from '@/features/members/components/leave-garden';
import { InviteForm } from '@/features/invitations/components/invite-form';
import { PendingInvitations } from '@/features/invitations/components/pending-invitations';

export function MembersPage() {
  const garden = useCurrentGarden();
  const me = useMe();
  const members = useMembers(garden.id);
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  const isOwner = garden.role === 'owner';
  const owners = members.data?.items.filter((m) => m.role === 'owner') ?? [];
  const soleOwner = isOwner && owners.length === 1 && owners[0].userId === me.data?.id;

  // The reader's own role moved: every page of this garden shows what that role may do.
  const ownRoleChanged = () => queryClient.invalidateQueries({ queryKey: gardenKeys.detail(garden.id) });
  const left = async () => {
    // Nothing of this garden is the reader's any more: out of the list first, so `/` opens another one.
    queryClient.setQueryData<GardenDto[]>(gardenKeys.list(), (list) => list?.filter((g) => g.id !== garden.id));
    await navigate('/', { replace: true });
    queryClient.removeQueries({ predicate: (q) => q.queryKey[1] === garden.id || (q.queryKey[0] === 'gardens' && q.queryKey[2] === garden.id) });
    await queryClient.invalidateQueries({ queryKey: gardenKeys.list() });
  };

  return (
    <div className="flex flex-col gap-6">
      <title>{`Members · ${garden.name} · Heatclock`}</title>
      <div>
        <h1 className="text-2xl font-bold sm:text-3xl">Members</h1>
        <p className="text-loam-soft">{`You are ${A_ROLE[garden.role]} here: ${A_ROLE[garden.role]} ${ROLE_MEANINGS[garden.role]}.`}</p>
        {isOwner && (
          <p className="mt-2">
            <Link to={`/g/${garden.id}/audit`} className="underline underline-offset-2">
              Audit trail: who changed which record, and when
            </Link>
          </p>
        )}
      </div>
      {members.isPending && <Loading label="Loading members…" />}
      {members.isError && <LoadProblem error={members.error} what="the members" onRetry={() => members.refetch()} retrying={members.isFetching} />}
      {members.data && (
        <MemberTable gardenId={garden.id} timeZone={garden.timeZone} members={members.data.items} myUserId={me.data?.id} canManage={isOwner} onOwnRoleChanged={ownRoleChanged} />
      )}
      {isOwner && (
        <>
          <InviteForm gardenId={garden.id} />
          <PendingInvitations gardenId={garden.id} timeZone={garden.timeZone} />
        </>
      )}
      {members.data && (
        <section aria-labelledby="leave-garden" className="flex flex-col gap-2">
          <h2 id="leave-garden" className="text-lg font-bold">Leaving</h2>
          <LeaveGarden gardenId={garden.id} gardenName={garden.name} soleOwner={soleOwner} onLeft={left} />
        </section>
      )}
    </div>
  );
}
