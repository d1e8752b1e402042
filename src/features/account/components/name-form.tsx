import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { nameChangeSchema } from '#shared/schemas/account';
import type { NameChangeInput } from '#shared/schemas/account';
import type { UserDto } from '#shared/schemas/auth';
import { applyServerFieldErrors } from '@/lib/form-errors';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { useUpdateName } from '@/features/account/api/update-name';

export function NameForm({ user, onSaved }: { user: UserDto; onSaved: (user: UserDto) => void }) {
  const update = useUpdateName();
  const [saved, setSaved] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting, isDirty },
  } = useForm<z.input<typeof nameChangeSchema>, unknown, NameChangeInput>({
    resolver: zodResolver(nameChangeSchema),
    defaultValues: { name: user.name },
  });

  const onSubmit = handleSubmit(async (values) => {
    setSaved(false);
    setProblem(null);
    try {
      const { user: changed } = await update.mutateAsync(values);
      reset({ name: changed.name });
      setSaved(true);
      onSaved(changed);
    } catch (error) {
      const { placed, leftover } = applyServerFieldErrors(error, setError, ['name']);
      if (placed === 0 || leftover.length > 0) setProblem([error instanceof Error ? error.message : 'Not saved.', ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {problem && (
        <Notice tone="error" title="Name not saved" live="alert">
          {problem}
        </Notice>
      )}
      <TextField label="Your name" autoComplete="name" hint="Other members of your gardens see this name." error={errors.name?.message} {...register('name')} />
      <div className="flex flex-wrap items-center gap-3">
        <Button type="submit" disabled={isSubmitting || !isDirty}>
          {isSubmitting ? 'Saving…' : 'Save name'}
        </Button>
        {saved && !isDirty && (
          <p role="status" className="text-sm text-leaf">
            Name saved.
          </p>
        )}
      </div>
    </form>
  );
}
