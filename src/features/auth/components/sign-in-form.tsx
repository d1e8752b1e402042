import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { loginSchema } from '#shared/schemas/auth';
import type { LoginInput } from '#shared/schemas/auth';
import { ApiError } from '@/lib/api-client';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { tooManyProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useLogin } from '@/features/auth/api/login';

function signInProblem(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something went wrong while signing in. Please try again.';
  if (error.status === 401) return error.message || 'E-mail or password is incorrect.';
  return tooManyProblem(error, 'Too many sign-in attempts') ?? error.message;
}

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const login = useLogin();
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof loginSchema>, unknown, LoginInput>({
    resolver: zodResolver(loginSchema),
    defaultValues: { email: '', password: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await login.mutateAsync(values);
      onSignedIn();
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, ['email', 'password']);
      if (placed === 0 || leftover.length > 0) setProblem([signInProblem(error), ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {problem && (
        <Notice tone="error" title="Not signed in" live="alert">
          {problem}
        </Notice>
      )}
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
        autoComplete="current-password"
        error={errors.password?.message}
        {...register('password')}
      />
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
