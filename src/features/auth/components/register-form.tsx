import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { registerSchema } from '#shared/schemas/auth';
import type { RegisterInput } from '#shared/schemas/auth';
import { ApiError } from '@/lib/api-client';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { tooManyProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useRegister } from '@/features/auth/api/register';

const FIELDS = ['email', 'password', 'name', 'gardenName'] as const;

function registerProblem(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something went wrong while creating your account. Please try again.';
  return tooManyProblem(error, 'Too many sign-ups') ?? error.message;
}

/** `onRegistered` gets the address the link went to; no account exists until that link is used. */
export function RegisterForm({ onRegistered }: { onRegistered: (email: string) => void }) {
  const registerAccount = useRegister();
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof registerSchema>, unknown, RegisterInput>({
    resolver: zodResolver(registerSchema),
    defaultValues: { email: '', password: '', name: '', gardenName: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await registerAccount.mutateAsync(values);
      onRegistered(values.email);
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, FIELDS);
      if (placed === 0 || leftover.length > 0) setProblem([registerProblem(error), ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {problem && (
        <Notice tone="error" title="Account not created" live="alert">
          {problem}
        </Notice>
      )}
      <TextField label="Your name" autoComplete="name" error={errors.name?.message} {...register('name')} />
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        inputMode="email"
        error={errors.email?.message}
        {...register('email')}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="new-password"
        hint="At least 10 characters. A few unrelated words make a strong one."
        error={errors.password?.message}
        {...register('password')}
      />
      <TextField
        label="Garden name"
        autoComplete="off"
        hint="Afterwards, Garden settings finds the location and time zone from a town or US ZIP code."
        error={errors.gardenName?.message}
        {...register('gardenName')}
      />
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Sending…' : 'Create account'}
      </Button>
    </form>
  );
}
