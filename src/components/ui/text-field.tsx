import { useId } from 'react';
import type { InputHTMLAttributes, ReactNode } from 'react';

/**
 * A labelled input with its hint, unit and error wired to it for assistive technology.
 * Register props from react-hook-form are spread straight through.
 */
export function TextField({
  label,
  hint,
  unit,
  error,
  className = '',
  ...input
}: InputHTMLAttributes<HTMLInputElement> & {
  label: ReactNode;
  hint?: ReactNode;
  unit?: string;
  error?: string;
}) {
  const id = useId();
  const hintId = `${id}-hint`;
  const errorId = `${id}-error`;
  const describedBy = [hint ? hintId : null, error ? errorId : null].filter(Boolean).join(' ');

  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      {hint && (
        <p id={hintId} className="text-sm text-loam-soft">
          {hint}
        </p>
      )}
      <div className="flex items-center gap-2">
        <input
          id={id}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy || undefined}
          className="min-h-11 w-full min-w-0 rounded-md border border-line bg-paper-raised px-3 py-2 text-loam aria-[invalid=true]:border-clay aria-[invalid=true]:border-2"
          {...input}
        />
        {unit && (
          <span className="shrink-0 text-loam-soft" aria-hidden="true">
            {unit}
          </span>
        )}
      </div>
      {error && <FieldError id={errorId}>{error}</FieldError>}
    </div>
  );
}

export function FieldError({ id, children }: { id?: string; children: ReactNode }) {
  return (
    <p id={id} className="text-sm font-semibold text-clay">
      <span aria-hidden="true">⚠ </span>
      {children}
    </p>
  );
}
