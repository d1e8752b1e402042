import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { passwordResetSchema } from '#shared/schemas/account';
import type { PasswordResetInput } from '#shared/schemas/account';
import { ApiError } from '@/lib/api-client';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useResetPassword } from '@/features/account/api/reset-password';

export const PASSWORD_HINT = 'At least 10 characters. A few unrelated words make a strong one.';

/** The form of a reset link: one new password; `onRefused` takes a link that can no longer work. */
export function NewPasswordForm({ token, onDone, onRefused }: { token: string; onDone: () => void; onRefused: (error: ApiError) => void }) {
  const reset = useResetPassword(token);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof passwordResetSchema>, unknown, PasswordResetInput>({
    resolver: zodResolver(passwordResetSchema),
    defaultValues: { password: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await reset.mutateAsync(values);
      onDone();
    } catch (error) {
      if (error instanceof ApiError && [404, 410].includes(error.status)) return onRefused(error);
      const { placed, leftover } = applyServerFieldErrors(error, setError, ['password']);
      if (placed === 0 || leftover.length > 0) setProblem([error instanceof Error ? error.message : 'Not saved.', ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {problem && (
        <Notice tone="error" title="Password not changed" live="alert">
          {problem}
        </Notice>
      )}
      <TextField label="New password" type="password" autoComplete="new-password" hint={PASSWORD_HINT} error={errors.password?.message} {...register('password')} />
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Saving…' : 'Save the new password'}
      </Button>
    </form>
  );
}
