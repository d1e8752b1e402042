import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { passwordResetRequestSchema } from '#shared/schemas/account';
import type { PasswordResetRequestInput } from '#shared/schemas/account';
import { ApiError } from '@/lib/api-client';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { tooManyProblem } from '@/lib/problems';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useRequestPasswordReset } from '@/features/account/api/request-password-reset';

function problemOf(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something went wrong while sending the link. Please try again.';
  return tooManyProblem(error, 'Too many reset requests') ?? error.message;
}

/** `onSent` gets the address; the page then says the same whether or not it has an account. */
export function ForgotPasswordForm({ onSent }: { onSent: (email: string) => void }) {
  const send = useRequestPasswordReset();
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof passwordResetRequestSchema>, unknown, PasswordResetRequestInput>({
    resolver: zodResolver(passwordResetRequestSchema),
    defaultValues: { email: '' },
  });

  const onSubmit = handleSubmit(async (values) => {
    setProblem(null);
    try {
      await send.mutateAsync(values);
      onSent(values.email);
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, ['email']);
      if (placed === 0 || leftover.length > 0) setProblem([problemOf(error), ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {problem && (
        <Notice tone="error" title="Link not sent" live="alert">
          {problem}
        </Notice>
      )}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="email"
        inputMode="email"
        hint="The e-mail you sign in with."
        error={errors.email?.message}
        {...register('email')}
      />
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? 'Sending…' : 'Send me a link'}
      </Button>
    </form>
  );
}
