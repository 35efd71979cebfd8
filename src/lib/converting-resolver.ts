import { zodResolver } from '@hookform/resolvers/zod';
import type { FieldValues, Resolver } from 'react-hook-form';
import type { z } from 'zod';

/**
 * A zodResolver on a shared schema for a form that shows values differently from how they are
 * stored (inches for mm, "49.50" for 4950 cents): `toStored` converts first, so the schema, its
 * messages and the submitted values are exactly the server's. Field names stay the same.
 */
export function convertingResolver<TForm extends FieldValues, S extends z.ZodType<FieldValues, FieldValues>>(
  schema: S,
  toStored: (values: TForm) => unknown,
): Resolver<TForm, unknown, z.output<S>> {
  const inner = zodResolver(schema) as unknown as Resolver<FieldValues, unknown, z.output<S>>;
  return ((values: TForm, context: unknown, options: Parameters<Resolver<FieldValues>>[2]) =>
    inner(toStored(values) as FieldValues, context, options)) as unknown as Resolver<TForm, unknown, z.output<S>>;
}
