import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { newAccountAcceptSchema } from '#shared/schemas/invitations';
import type { NewAccountAcceptInput } from '#shared/schemas/invitations';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { mutationProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';

const FIELDS = ['name', 'password'] as const;

/** For an address with no account yet: the account is made with the invitation, and signed in. */
export function NewAccountForm({ email, onSubmit }: { email: string; onSubmit: (account: NewAccountAcceptInput) => Promise<unknown> }) {
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof newAccountAcceptSchema>, unknown, NewAccountAcceptInput>({
    resolver: zodResolver(newAccountAcceptSchema),
    defaultValues: { name: '', password: '' },
  });

  const submit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await onSubmit(values);
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, FIELDS);
      if (placed === 0 || leftover.length > 0) setProblem([mutationProblem(error), ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={submit} noValidate aria-label="Create your account and join" className="flex flex-col gap-4">
      {problem && (
        <Notice tone="error" title="Not joined yet" live="alert">{problem}</Notice>
      )}
      <div className="flex flex-col gap-1">
        <p className="font-semibold">E-mail</p>
        <p className="break-all">{email}</p>
        <p className="text-sm text-loam-soft">Your account uses the address the invitation was sent to.</p>
      </div>
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register('name')} />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. A few unrelated words make a strong one."
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Creating your account…' : 'Create account and join'}
      </Button>
    </form>
  );
}
