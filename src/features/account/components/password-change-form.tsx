import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { passwordChangeSchema } from '#shared/schemas/account';
import type { PasswordChangeInput } from '#shared/schemas/account';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { tooManyProblem } from '@/lib/problems';
import { countOf } from '#shared/format/count-words';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useChangePassword } from '@/features/account/api/change-password';
import { PASSWORD_HINT } from '@/features/account/components/new-password-form';

function problemOf(error: unknown): string {
  return tooManyProblem(error, 'Too many wrong passwords') ?? (error instanceof Error ? error.message : 'Not saved.');
}

export function PasswordChangeForm() {
  const change = useChangePassword();
  const [ended, setEnded] = useState<number | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof passwordChangeSchema>, unknown, PasswordChangeInput>({
    resolver: zodResolver(passwordChangeSchema),
    defaultValues: { currentPassword: '', password: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    setEnded(null);
    setProblem(null);
    try {
      const { endedSessions } = await change.mutateAsync(values);
      reset({ currentPassword: '', password: '' });
      setEnded(endedSessions);
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, ['currentPassword', 'password']);
      if (placed === 0 || leftover.length > 0) setProblem([problemOf(error), ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {ended !== null && (
        <Notice tone="success" title="Password changed" live="status">
          {ended === 0
            ? 'This device stays signed in; no other device was signed in.'
            : `This device stays signed in; ${countOf(ended, 'other device')} now signed out.`}
        </Notice>
      )}
      {problem && (
        <Notice tone="error" title="Password not changed" live="alert">
          {problem}
        </Notice>
      )}
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        error={errors.currentPassword?.message}
        {...register('currentPassword')}
      />
      <TextField label="New password" type="password" autoComplete="new-password" hint={PASSWORD_HINT} error={errors.password?.message} {...register('password')} />
      <p className="text-sm text-loam-soft">Changing the password signs you out on every other device.</p>
      <Button type="submit" className="self-start" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Change password'}
      </Button>
    </form>
  );
}
