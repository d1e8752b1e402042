import { useState } from 'react';
import { ROLES } from '#shared/schemas/gardens';
import type { Role } from '#shared/schemas/gardens';
import { ROLE_LABELS } from '#shared/schemas/members';
import type { MemberDto } from '#shared/schemas/members';
import { formatInstant } from '@/lib/format';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { useChangeMemberRole } from '@/features/members/api/change-member-role';
import { useRemoveMember } from '@/features/members/api/remove-member';

const CONTROL = 'min-h-11 w-full max-w-48 rounded-md border border-line bg-paper-raised px-3 py-2';
const LAST_OWNER = 'The only owner keeps the owner role: make someone else an owner first.';

/**
 * The garden's people. Owners get a role select and Remove on each row; both ask once before
 * anything changes. Below 768 px each row becomes a small card.
 */
export function MemberTable({
  gardenId,
  members,
  myUserId,
  canManage,
  timeZone,
  onOwnRoleChanged,
}: {
  gardenId: number;
  timeZone: string;
  members: MemberDto[];
  myUserId: number | undefined;
  canManage: boolean;
  onOwnRoleChanged: () => unknown;
}) {
  const owners = members.filter((m) => m.role === 'owner').length;
  return (
    <table className="w-full border-collapse text-left max-md:block">
      <caption className="sr-only">Members of this garden and their roles</caption>
      <thead className="max-md:sr-only">
        <tr className="border-b border-line">
          <th scope="col" className="py-2 pr-3">Name</th>
          <th scope="col" className="py-2 pr-3">Role</th>
          <th scope="col" className="py-2 pr-3">Joined</th>
          {canManage && <th scope="col" className="py-2">Change</th>}
        </tr>
      </thead>
      <tbody className="max-md:flex max-md:flex-col max-md:gap-3">
        {members.map((m) => (
          <MemberRow
            key={m.userId}
            gardenId={gardenId}
            member={m}
            isMe={m.userId === myUserId}
            canManage={canManage}
            soleOwner={m.role === 'owner' && owners <= 1}
            timeZone={timeZone}
            onOwnRoleChanged={onOwnRoleChanged}
          />
        ))}
      </tbody>
    </table>
  );
}

function MemberRow({
  gardenId,
  member,
  isMe,
  canManage,
  soleOwner,
  timeZone,
  onOwnRoleChanged,
}: {
  gardenId: number;
  timeZone: string;
  member: MemberDto;
  isMe: boolean;
  canManage: boolean;
  soleOwner: boolean;
  onOwnRoleChanged: () => unknown;
}) {
  const [wanted, setWanted] = useState<Role | null>(null);
  const [removing, setRemoving] = useState(false);
  const change = useChangeMemberRole(gardenId, (changed) => (changed.userId === member.userId && isMe ? onOwnRoleChanged() : undefined));
  const remove = useRemoveMember(gardenId);
  const who = isMe ? `${member.name} (you)` : member.name;
  const selectId = `member-role-${member.userId}`;

  return (
    <tr className="border-b border-line align-top max-md:flex max-md:flex-col max-md:gap-2 max-md:rounded-lg max-md:border max-md:bg-paper-raised max-md:p-3">
      <td className="py-2 pr-3 max-md:py-0">
        <span className="font-semibold">{who}</span>
        {member.email && <span className="block text-sm break-all text-loam-soft">{member.email}</span>}
      </td>
      <td className="py-2 pr-3 max-md:py-0">
        {canManage ? (
          <div className="flex flex-col gap-1">
            <label htmlFor={selectId} className="sr-only">{`Role of ${member.name}`}</label>
            <select
              id={selectId}
              className={CONTROL}
              value={wanted ?? member.role}
              disabled={soleOwner || change.isPending}
              aria-describedby={soleOwner ? `${selectId}-why` : undefined}
              onChange={(e) => {
                change.reset();
                const next = e.target.value as Role;
                setWanted(next === member.role ? null : next);
              }}
            >
              {ROLES.map((r) => (
                <option key={r} value={r}>{ROLE_LABELS[r]}</option>
              ))}
            </select>
            {soleOwner && <p id={`${selectId}-why`} className="text-sm text-loam-soft">{LAST_OWNER}</p>}
          </div>
        ) : (
          ROLE_LABELS[member.role]
        )}
        {wanted && (
          <div role="group" aria-label={`Change the role of ${member.name}`} className="mt-2 flex flex-col gap-2 rounded-md border-2 border-frost bg-frost-tint p-3">
            <p className="font-semibold">
              {isMe ? `Make yourself ${ROLE_LABELS[wanted].toLowerCase()}?` : `Make ${member.name} ${ROLE_LABELS[wanted].toLowerCase()}?`}
            </p>
            {isMe && wanted !== 'owner' && <p className="text-sm">You will no longer be able to manage members or settings here.</p>}
            <div className="flex flex-wrap gap-2">
              <Button onClick={() => change.mutate({ userId: member.userId, role: wanted }, { onSuccess: () => setWanted(null) })} disabled={change.isPending}>
                {change.isPending ? 'Changing…' : 'Change role'}
              </Button>
              <Button variant="quiet" onClick={() => { change.reset(); setWanted(null); }} disabled={change.isPending}>
                Keep {ROLE_LABELS[member.role].toLowerCase()}
              </Button>
            </div>
          </div>
        )}
        {change.error && (
          <div className="mt-2">
            <Notice tone="error" title="Role not changed" live="alert">{change.error.message}</Notice>
          </div>
        )}
      </td>
      <td className="py-2 pr-3 text-loam-soft max-md:py-0">
        <span className="md:sr-only">Joined </span>
        {formatInstant(member.joinedAt, timeZone)}
      </td>
      {canManage && (
        <td className="py-2 max-md:py-0">
          {!isMe &&
            (removing ? (
              <div role="group" aria-label={`Remove ${member.name}`} className="flex flex-col gap-2 rounded-md border-2 border-clay bg-clay-tint p-3">
                <p className="font-semibold">{`Remove ${member.name} from this garden?`}</p>
                <p className="text-sm">They lose access at once. You can invite them again later.</p>
                <div className="flex flex-wrap gap-2">
                  <Button variant="danger" onClick={() => remove.mutate(member.userId)} disabled={remove.isPending}>
                    {remove.isPending ? 'Removing…' : 'Remove'}
                  </Button>
                  <Button variant="quiet" onClick={() => { remove.reset(); setRemoving(false); }} disabled={remove.isPending}>
                    Keep them
                  </Button>
                </div>
                {remove.error && <Notice tone="error" title="Not removed" live="alert">{remove.error.message}</Notice>}
              </div>
            ) : (
              <Button
                variant="quiet-danger"
                onClick={() => setRemoving(true)}
                disabled={soleOwner}
                disabledReason={soleOwner ? LAST_OWNER : undefined}
                aria-label={`Remove ${member.name}`}
              >
                Remove
              </Button>
            ))}
        </td>
      )}
    </tr>
  );
}
