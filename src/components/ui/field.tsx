import { useId, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';
import { cx } from '#src/lib/cx.ts';

type FieldFrameProps = {
  id?: string;
  label: string;
  hint?: string;
  error?: string;
  className?: string;
  children: (ids: { inputId: string; describedBy?: string; invalid?: true }) => ReactNode;
};

/**
 * A label, an optional hint and a field-level error, tied to the control for screen readers.
 * TextField, SelectField and TextAreaField share it.
 */
export function FieldFrame({ id, label, hint, error, className, children }: FieldFrameProps) {
  const generated = useId();
  const inputId = id ?? generated;
  const hintId = hint ? `${inputId}-hint` : undefined;
  const errorId = error ? `${inputId}-error` : undefined;
  return (
    <div className={cx('flex flex-col gap-1.5', className)}>
      <label htmlFor={inputId} className="text-sm font-semibold text-graphite-800">
        {label}
      </label>
      {children({ inputId, describedBy: [hintId, errorId].filter(Boolean).join(' ') || undefined, invalid: error ? true : undefined })}
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

export const controlClasses = (error?: string) =>
  cx(
    // Focus shows as the page-wide ring (src/styles/index.css), strong enough for WCAG 2.4.13.
    'rounded-lg border bg-white px-3 text-graphite-900 placeholder:text-graphite-400 disabled:bg-graphite-50 disabled:text-graphite-600',
    error ? 'border-rust-600' : 'border-graphite-200 focus:border-accent',
  );

export type SelectFieldProps = SelectHTMLAttributes<HTMLSelectElement> & {
  label: string;
  hint?: string;
  error?: string;
  options: ReadonlyArray<{ value: string; label: string }>;
  /** A first, empty choice ("Choose…") for fields without a default. */
  placeholder?: string;
};

export function SelectField({ label, hint, error, className, options, placeholder, ...rest }: SelectFieldProps) {
  return (
    <FieldFrame label={label} hint={hint} error={error} className={className}>
      {({ inputId, describedBy, invalid }) => (
        <select id={inputId} aria-invalid={invalid} aria-describedby={describedBy} className={cx(controlClasses(error), 'h-10')} {...rest}>
          {placeholder !== undefined && <option value="">{placeholder}</option>}
          {options.map((o) => (
            <option key={o.value} value={o.value}>
              {o.label}
            </option>
          ))}
        </select>
      )}
    </FieldFrame>
  );
}

export type TextAreaFieldProps = TextareaHTMLAttributes<HTMLTextAreaElement> & { label: string; hint?: string; error?: string };

export function TextAreaField({ label, hint, error, className, rows = 3, ...rest }: TextAreaFieldProps) {
  return (
    <FieldFrame label={label} hint={hint} error={error} className={className}>
      {({ inputId, describedBy, invalid }) => (
        <textarea
          id={inputId}
          rows={rows}
          aria-invalid={invalid}
          aria-describedby={describedBy}
          className={cx(controlClasses(error), 'py-2')}
          {...rest}
        />
      )}
    </FieldFrame>
  );
}
