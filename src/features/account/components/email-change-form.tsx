import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { emailChangeSchema } from '#shared/schemas/account';
import type { EmailChangeInput } from '#shared/schemas/account';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { tooManyProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useRequestEmailChange } from '@/features/account/api/request-email-change';

function problemOf(error: unknown): string {
  // Two limits can refuse it (wrong passwords, too many changes): the server says which.
  return tooManyProblem(error) ?? (error instanceof Error ? error.message : 'Not sent.');
}

/** The address changes only when the link mailed to the new address is opened. */
export function EmailChangeForm({ currentEmail }: { currentEmail: string }) {
  const send = useRequestEmailChange();
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof emailChangeSchema>, unknown, EmailChangeInput>({
    resolver: zodResolver(emailChangeSchema),
    defaultValues: { email: '', password: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    setSentTo(null);
    setProblem(null);
    try {
      await send.mutateAsync(values);
      reset({ email: '', password: '' });
      setSentTo(values.email);
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, ['email', 'password']);
      if (placed === 0 || leftover.length > 0) setProblem([problemOf(error), ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      <p>
        You sign in with <strong className="break-all">{currentEmail}</strong>.
      </p>
      {sentTo && (
        <Notice tone="success" title="Check the new address" live="status">
          We sent a link to <strong className="break-all">{sentTo}</strong>. Your e-mail changes only when that link is opened, within 24 hours. Until
          then you keep signing in with {currentEmail}.
        </Notice>
      )}
      {problem && (
        <Notice tone="error" title="Link not sent" live="alert">
          {problem}
        </Notice>
      )}
      <TextField label="New e-mail" type="email" autoComplete="email" inputMode="email" error={errors.email?.message} {...register('email')} />
      <TextField
        label="Current password"
        type="password"
        autoComplete="current-password"
        hint="So that only you can move the account."
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" className="self-start" disabled={isSubmitting}>
        {isSubmitting ? 'Sending…' : 'Send a link to the new e-mail'}
      </Button>
    </form>
  );
}
