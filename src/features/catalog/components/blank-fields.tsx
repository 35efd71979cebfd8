import type { UseFormReturn } from 'react-hook-form';
import type { z } from 'zod';
import type { blankInputSchema, BlankInput, MaterialView } from '#shared/schemas/catalog.ts';
import { SelectField, TextAreaField } from '#src/components/ui/field.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { shapeOptions, statusOptions } from '../labels.ts';

export type BlankFormValues = z.input<typeof blankInputSchema>;
export type BlankForm = UseFormReturn<BlankFormValues, unknown, BlankInput>;

export const blankDefaults = (materials: MaterialView[]): BlankFormValues => ({
  name: '',
  description: '',
  materialId: materials.find((m) => m.forbiddenOn.length === 0)?.id ?? '',
  shape: 'rectangle',
  status: 'draft',
  sortOrder: 0,
});

/** The fields of a blank, shared by the new-blank dialog and the blank's own page. */
/** The blank's fields; a blank's own page sets its status with its buttons instead (`withStatus` false). */
export function BlankFields({ form, materials, withStatus = true }: { form: BlankForm; materials: MaterialView[]; withStatus?: boolean }) {
  const { register, formState } = form;
  const errors = formState.errors;
  return (
    <div className="grid gap-4 sm:grid-cols-2">
      <TextField
        label="Name"
        {...register('name')}
        error={errors.name?.message}
        className="sm:col-span-2"
        hint="What buyers see, such as “Black glass photo block”."
      />
      <TextAreaField label="Description" {...register('description')} error={errors.description?.message} className="sm:col-span-2" />
      <SelectField
        label="Material"
        placeholder="Choose a material…"
        options={materials.filter((m) => m.forbiddenOn.length < 3).map((m) => ({ value: m.id, label: m.name }))}
        {...register('materialId')}
        error={errors.materialId?.message}
      />
      <SelectField label="Shape" options={shapeOptions} {...register('shape')} error={errors.shape?.message} />
      {withStatus && (
        <SelectField
          label="Status"
          options={statusOptions}
          {...register('status')}
          error={errors.status?.message}
          hint="Only blanks on sale appear on the storefront."
        />
      )}
      <TextField
        label="Position on the storefront"
        type="number"
        inputMode="numeric"
        {...register('sortOrder', { valueAsNumber: true })}
        error={errors.sortOrder?.message}
        hint="Lower numbers come first."
      />
    </div>
  );
}
