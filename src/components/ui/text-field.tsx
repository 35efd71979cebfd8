import { useId, type InputHTMLAttributes } from 'react';
import { cx } from '../../lib/cx.ts';

export type TextFieldProps = InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  hint?: string;
  error?: string;
};

/** A labelled input with an optional hint and a field-level error tied to it for screen readers. */
export function TextField({ label, hint, error, className, id, ...rest }: TextFieldProps) {
  const generated = useId();
  const inputId = id ?? generated;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = error ? `${inputId}-error` : undefined;
  return (
    <div className={cx('flex flex-col gap-1.5', className)}>
      <label htmlFor={inputId} className="text-sm font-semibold text-graphite-800">
        {label}
      </label>
      <input
        id={inputId}
        aria-invalid={error ? true : undefined}
        aria-describedby={[hintId, errorId].filter(Boolean).join(' ') || undefined}
        className={cx(
          'h-10 rounded-lg border bg-white px-3 text-graphite-900 placeholder:text-graphite-400 focus:outline-none focus:ring-2',
          error ? 'border-rust-600 focus:ring-rust-100' : 'border-graphite-200 focus:border-accent focus:ring-ember-100',
        )}
        {...rest}
      />
      {hint && !error && (
        <p id={hintId} className="text-xs text-graphite-500">
          {hint}
        </p>
      )}
      {error && (
        <p id={errorId} className="text-xs font-semibold text-rust-600">
          {error}
        </p>
      )}
    </div>
  );
}
