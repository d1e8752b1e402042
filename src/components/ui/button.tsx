import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'quiet';

const VARIANTS: Record<Variant, string> = {
  primary: 'bg-loam text-paper-raised hover:bg-loam-soft disabled:bg-loam-soft',
  quiet: 'border border-line bg-paper-raised text-loam hover:bg-paper-sunk',
};

export function Button({
  variant = 'primary',
  className = '',
  type = 'button',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type={type}
      className={`inline-flex min-h-11 items-center justify-center gap-2 rounded-md px-4 py-2 font-semibold disabled:cursor-not-allowed ${VARIANTS[variant]} ${className}`}
      {...props}
    />
  );
}
