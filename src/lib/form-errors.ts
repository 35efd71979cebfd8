import type { FieldValues, Path, UseFormReturn } from 'react-hook-form';
import { AppError } from '#shared/errors.ts';

/**
 * Shows a failed save on a react-hook-form form: the server's field issues beside their fields
 * (the same messages the shared schema gives in the browser), any other failure above the form.
 */
export function showServerError<T extends FieldValues>(form: Pick<UseFormReturn<T>, 'setError'>, error: unknown): void {
  const issues = error instanceof AppError ? (error.issues ?? []) : [];
  for (const issue of issues) form.setError(String(issue.path[0] ?? 'root') as Path<T>, { type: 'server', message: issue.message });
  // A message already shown beside its field is not repeated above the form.
  if (issues.length === 0) form.setError('root.server' as Path<T>, { type: 'server', message: (error as Error).message });
}

/** The message `showServerError` put above the form, if any. */
export const serverErrorOf = (form: { formState: { errors: { root?: Record<string, { message?: string } | undefined> } } }) =>
  form.formState.errors.root?.server?.message;
