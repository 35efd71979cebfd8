import type { InputHTMLAttributes } from 'react';
import { cx } from '#src/lib/cx.ts';
import { controlClasses, FieldFrame } from './field.tsx';

export type TextFieldProps = InputHTMLAttributes<HTMLInputElement> & {
  label: string;
  hint?: string;
  error?: string;
  /** A unit shown after the value ("mm", "%", "W"). */
  suffix?: string;
};

/** A labelled input with an optional hint and a field-level error tied to it for screen readers. */
export function TextField({ label, hint, error, className, id, suffix, ...rest }: TextFieldProps) {
  return (
    <FieldFrame id={id} label={label} hint={hint} error={error} className={className}>
      {({ inputId, describedBy, invalid }) => {
        const input = (
          <input
            id={inputId}
            aria-invalid={invalid}
            aria-describedby={describedBy}
            className={cx(controlClasses(error), 'h-10 w-full min-w-0')}
            {...rest}
          />
        );
        return suffix ? (
          <div className="flex items-center gap-2">
            {input}
            <span className="shrink-0 text-sm text-graphite-500">{suffix}</span>
          </div>
        ) : (
          input
        );
      }}
    </FieldFrame>
  );
}
