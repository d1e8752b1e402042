import { useId, useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { ROLES } from '#shared/schemas/gardens';
import { invitationCreateSchema } from '#shared/schemas/invitations';
import type { InvitationCreateInput } from '#shared/schemas/invitations';
import { A_ROLE, ROLE_LABELS, ROLE_MEANINGS } from '#shared/schemas/members';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { mutationProblem } from '@/lib/problems';
import { useSubmissionKey } from '@/lib/use-submission-key';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { FieldError, TextField } from '@/components/ui/text-field';
import { useCreateInvitation } from '@/features/invitations/api/create-invitation';

const FIELDS = ['email', 'role'] as const;
const CONTROL = 'min-h-11 w-full rounded-md border border-line bg-paper-raised px-3 py-2';

export function InviteForm({ gardenId }: { gardenId: number }) {
  const create = useCreateInvitation(gardenId);
  const submission = useSubmissionKey();
  const roleId = useId();
  const [problem, setProblem] = useState<string | null>(null);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof invitationCreateSchema>, unknown, InvitationCreateInput>({
    resolver: zodResolver(invitationCreateSchema),
    defaultValues: { email: '', role: 'grower' },
  });
  const role = watch('role');

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    setSentTo(null);
    try {
      const made = await create.mutateAsync({ ...values, idempotencyKey: submission.keyFor(values) });
      submission.renew();
      reset({ email: '', role: values.role });
      setSentTo(made.email);
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, FIELDS);
      if (placed === 0 || leftover.length > 0) setProblem([mutationProblem(error), ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate aria-label="Invite someone" className="grid gap-3 rounded-lg border border-line bg-paper-raised p-4 sm:grid-cols-2">
      <h2 className="text-lg font-bold sm:col-span-2">Invite someone</h2>
      <p className="text-sm text-loam-soft sm:col-span-2">They get an e-mail with a link that works once, for 7 days.</p>
      {problem && (
        <div className="sm:col-span-2">
          <Notice tone="error" title="Invitation not sent" live="alert">{problem}</Notice>
        </div>
      )}
      {sentTo && (
        <div className="sm:col-span-2">
          <Notice tone="success" title="Invitation sent" live="status">{`We e-mailed an invitation to ${sentTo}.`}</Notice>
        </div>
      )}
      <TextField label="E-mail" type="email" autoComplete="off" inputMode="email" error={errors.email?.message} {...register('email')} />
      <div className="flex flex-col gap-1">
        <label htmlFor={roleId} className="font-semibold">Role</label>
        <select id={roleId} className={CONTROL} aria-describedby={`${roleId}-meaning`} aria-invalid={errors.role ? true : undefined} {...register('role')}>
          {ROLES.map((r) => (
            <option key={r} value={r}>{ROLE_LABELS[r]}</option>
          ))}
        </select>
        <p id={`${roleId}-meaning`} className="text-sm text-loam-soft">
          {ROLES.includes(role) ? `${A_ROLE[role].replace(/^a/, 'A')} ${ROLE_MEANINGS[role]}.` : ''}
        </p>
        {errors.role?.message && <FieldError>{errors.role.message}</FieldError>}
      </div>
      <Button type="submit" disabled={isSubmitting} className="sm:col-span-2 sm:justify-self-start">
        {isSubmitting ? 'Sending…' : 'Send invitation'}
      </Button>
    </form>
  );
}
