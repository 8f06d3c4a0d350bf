import type { ButtonHTMLAttributes } from 'react';

type Variant = 'primary' | 'secondary' | 'danger';

const STYLES: Record<Variant, string> = {
  primary: 'bg-moss text-white hover:bg-moss-dark disabled:bg-neutral-400',
  secondary: 'border-2 border-ink bg-card text-ink hover:bg-paper disabled:opacity-50',
  danger: 'border-2 border-brick bg-card text-brick hover:bg-brick-bg disabled:opacity-50',
};

/** Ringcall's button: at least 56 px tall, pressed state visible at once. */
export function Button({
  variant = 'primary',
  className = '',
  ...props
}: ButtonHTMLAttributes<HTMLButtonElement> & { variant?: Variant }) {
  return (
    <button
      type="button"
      className={`min-h-14 rounded-lg px-5 text-lg font-bold transition-transform active:scale-[0.97] disabled:cursor-not-allowed ${STYLES[variant]} ${className}`}
      {...props}
    />
  );
}
