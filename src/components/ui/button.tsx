import type { ButtonHTMLAttributes } from 'react';
import { cx } from '#src/lib/cx.ts';

const variants = {
  primary: 'bg-accent text-white hover:brightness-110 active:brightness-95 shadow-sm',
  secondary: 'bg-white text-graphite-900 ring-1 ring-inset ring-graphite-200 hover:bg-birch-100',
  quiet: 'bg-transparent text-graphite-700 hover:bg-graphite-100',
  danger: 'bg-rust-600 text-white hover:bg-rust-800 shadow-sm',
} as const;

const sizes = {
  sm: 'h-8 px-3 text-sm',
  md: 'h-10 px-4 text-[0.95rem]',
  lg: 'h-12 px-6 text-base',
} as const;

export type ButtonProps = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: keyof typeof variants;
  size?: keyof typeof sizes;
  busy?: boolean;
};

/** A button; `busy` disables it and says so to screen readers while work is under way. */
export function Button({
  variant = 'primary',
  size = 'md',
  busy = false,
  className,
  children,
  disabled,
  type = 'button',
  ...rest
}: ButtonProps) {
  return (
    <button
      type={type}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={cx(
        'inline-flex items-center justify-center gap-2 rounded-lg font-semibold transition disabled:cursor-not-allowed disabled:opacity-55',
        variants[variant],
        sizes[size],
        className,
      )}
      {...rest}
    >
      {busy && <span aria-hidden className="size-4 animate-spin rounded-full border-2 border-current border-r-transparent" />}
      {children}
    </button>
  );
}

/** Classes for a link that looks like a button. */
export function buttonClasses(variant: keyof typeof variants = 'primary', size: keyof typeof sizes = 'md'): string {
  return cx('inline-flex items-center justify-center gap-2 rounded-lg font-semibold transition', variants[variant], sizes[size]);
}
