import { useState } from 'react';
import type { z } from 'zod';
import { AppError, type FieldIssue } from '#shared/errors.ts';

type Errors = Record<string, string | undefined>;

const byField = (issues: FieldIssue[] | undefined): Errors =>
  Object.fromEntries((issues ?? []).map((issue) => [String(issue.path[0] ?? ''), issue.message]));

/**
 * Field-level messages for a form checked with a shared schema: the same messages whether the
 * browser or the server found the problem. `run` does a submission: busy while it lasts, and a
 * failure shown on the form.
 */
export function useFieldErrors() {
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string>();
  const [busy, setBusy] = useState(false);
  const show = (error: unknown) => {
    if (error instanceof AppError && error.issues?.length) setErrors(byField(error.issues));
    setFormError((error as Error).message);
  };
  return {
    errors,
    formError,
    busy,
    async run(work: () => Promise<void>): Promise<void> {
      setBusy(true);
      try {
        await work();
      } catch (error) {
        show(error);
      } finally {
        setBusy(false);
      }
    },
    /** Parses the values; shows the schema's messages and returns undefined when they fail. */
    check<S extends z.ZodType>(schema: S, values: unknown): z.infer<S> | undefined {
      const result = schema.safeParse(values);
      setFormError(undefined);
      if (result.success) {
        setErrors({});
        return result.data;
      }
      setErrors(byField(result.error.issues.map((i) => ({ path: i.path.map(String), message: i.message }))));
      return undefined;
    },
    /** Shows a failed call: its field issues beside the fields, the rest above the form. */
    show,
    clear() {
      setErrors({});
      setFormError(undefined);
    },
  };
}
