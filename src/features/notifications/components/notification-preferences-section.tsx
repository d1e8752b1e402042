import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { ALERT_TYPES, ALERT_TYPE_WORDS } from '#shared/schemas/alerts';
import { DELIVERIES, DELIVERY_WORDS, notificationPreferenceInputSchema } from '#shared/schemas/notifications';
import type { NotificationPreferenceDto, NotificationPreferenceInput } from '#shared/schemas/notifications';
import { ApiError } from '@/lib/api-client';
import { Button } from '@/components/ui/button';
import { LoadProblem } from '@/components/ui/load-problem';
import { Loading } from '@/components/ui/loading';
import { Notice } from '@/components/ui/notice';
import { FieldError } from '@/components/ui/text-field';
import { useNotificationPreferences } from '@/features/notifications/api/get-notification-preferences';
import { useUpdateNotificationPreferences } from '@/features/notifications/api/update-notification-preferences';

const FIELDS = ['delivery', 'digestHour', 'types'] as const;
const hourWords = (h: number) => `${String(h).padStart(2, '0')}:00`;

function PreferencesForm({ item }: { item: NotificationPreferenceDto }) {
  const update = useUpdateNotificationPreferences();
  const [saved, setSaved] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    watch,
    formState: { errors, isSubmitting },
  } = useForm<NotificationPreferenceInput>({
    resolver: zodResolver(notificationPreferenceInputSchema),
    defaultValues: { gardenId: item.gardenId, delivery: item.delivery, digestHour: item.digestHour, types: item.types },
  });
  const delivery = watch('delivery');

  const onSubmit = handleSubmit(async (values) => {
    setSaved(false);
    setProblem(null);
    try {
      await update.mutateAsync({ items: [values] });
      setSaved(true);
    } catch (error) {
      // The server names fields of the list it was sent ("items.0.digestHour"); this form edits item 0.
      const fields = error instanceof ApiError ? Object.entries(error.fields) : [];
      const leftover: string[] = [];
      for (const [field, message] of fields) {
        const name = FIELDS.find((f) => field === `items.0.${f}` || field.startsWith(`items.0.${f}.`));
        if (name) setError(name, { type: 'server', message });
        else leftover.push(message);
      }
      if (!fields.length || leftover.length) setProblem([error instanceof Error ? error.message : 'Not saved.', ...leftover].join(' '));
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {problem && (
        <Notice tone="error" title="Not saved" live="alert">
          {problem}
        </Notice>
      )}
      <fieldset className="flex flex-col gap-2" aria-describedby={errors.delivery ? 'email-delivery-error' : undefined}>
        <legend className="mb-1 font-semibold">When to send e-mail</legend>
        {DELIVERIES.map((d) => (
          <label key={d} className="flex min-h-11 items-center gap-3">
            <input type="radio" value={d} className="size-5" {...register('delivery')} />
            {DELIVERY_WORDS[d]}
          </label>
        ))}
        {errors.delivery && <FieldError id="email-delivery-error">{errors.delivery.message}</FieldError>}
      </fieldset>
      <div className="flex flex-col gap-1">
        <label htmlFor="email-digest-hour" className="font-semibold">
          Daily summary at
        </label>
        <p id="email-digest-hour-hint" className="text-sm text-loam-soft">
          In the garden’s own time zone.{delivery !== 'digest' && ' Used when you choose the daily summary.'}
        </p>
        <select
          id="email-digest-hour"
          aria-describedby="email-digest-hour-hint"
          aria-invalid={errors.digestHour ? true : undefined}
          className="min-h-11 w-40 rounded-md border border-line bg-paper-raised px-3 py-2"
          {...register('digestHour', { valueAsNumber: true })}
        >
          {Array.from({ length: 24 }, (_, h) => (
            <option key={h} value={h}>
              {hourWords(h)}
            </option>
          ))}
        </select>
        {errors.digestHour && <FieldError>{errors.digestHour.message}</FieldError>}
      </div>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 font-semibold">Alerts to e-mail</legend>
        {ALERT_TYPES.map((t) => (
          <label key={t} className="flex min-h-11 items-center gap-3">
            <input type="checkbox" value={t} className="size-5" {...register('types')} />
            {ALERT_TYPE_WORDS[t]}
          </label>
        ))}
        {errors.types && <FieldError>{errors.types.message ?? errors.types.root?.message}</FieldError>}
      </fieldset>
      <div className="flex flex-wrap items-center gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Save e-mail settings'}
        </Button>
        <p role="status" className="text-leaf">
          {saved && 'E-mail settings saved.'}
        </p>
      </div>
    </form>
  );
}

/** The signed-in member's e-mail choices for one garden (each member sets their own, whatever their role). */
export function NotificationPreferencesSection({ gardenId }: { gardenId: number }) {
  const prefs = useNotificationPreferences();
  const item = prefs.data?.items.find((i) => i.gardenId === gardenId);
  return (
    <section id="email" aria-labelledby="email-heading" className="flex flex-col gap-4 rounded-lg border border-line bg-paper-raised p-4 sm:p-6">
      <h2 id="email-heading" className="text-xl font-bold">
        Your e-mail from this garden
      </h2>
      {prefs.isPending && <Loading label="Loading your e-mail settings…" />}
      {prefs.isError && (
        <LoadProblem error={prefs.error} what="your e-mail settings" onRetry={() => prefs.refetch()} retrying={prefs.isFetching} />
      )}
      {/* Keyed so another garden starts from its own stored values. */}
      {item && <PreferencesForm key={item.gardenId} item={item} />}
    </section>
  );
}
