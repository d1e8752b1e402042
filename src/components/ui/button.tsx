import { useId } from 'react';
import type { ButtonHTMLAttributes, MouseEvent } from 'react';

/** `danger` is for the step that removes something for good; `quiet-danger` for the button that asks first. */
type Variant = 'primary' | 'quiet' | 'danger' | 'quiet-danger';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-loam text-paper-raised hover:bg-loam-soft',
  quiet: 'border border-line bg-paper-raised text-loam hover:bg-paper-sunk',
  danger: 'bg-clay text-paper-raised hover:bg-loam',
  'quiet-danger': 'border border-clay bg-paper-raised text-clay hover:bg-clay-tint',
};

// Inactive buttons look inactive: faded, dashed, no hover change, the not-allowed pointer.
const INACTIVE = 'cursor-not-allowed border-dashed opacity-55 hover:bg-[inherit]';

/**
 * A button. With `disabledReason`, an inactive button stays focusable (aria-disabled, not
 * disabled) and says why on hover and to screen readers, instead of silently doing nothing.
 */
export function Button({
  variant = 'primary',
  className = '',
  type = 'button',
  disabled,
  disabledReason,
  onClick,
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant; disabledReason?: string }) {
  const reasonId = useId();
  const explained = !!disabled && !!disabledReason;
  const inactive = !!disabled;
  return (
    <>
      <button
        {...props}
        type={type}
        data-variant={variant}
        disabled={inactive && !explained}
        aria-disabled={explained || undefined}
        aria-describedby={explained ? reasonId : props['aria-describedby']}
        title={explained ? disabledReason : props.title}
        onClick={explained ? (e: MouseEvent<HTMLButtonElement>) => e.preventDefault() : onClick}
        className={`inline-flex min-h-11 items-center justify-center gap-2 rounded-md px-4 py-2 font-semibold ${VARIANTS[variant]} ${inactive ? INACTIVE : ''} ${className}`}
      />
      {explained && (
        <span id={reasonId} className="sr-only">
          {disabledReason}
        </span>
      )}
    </>
  );
}
