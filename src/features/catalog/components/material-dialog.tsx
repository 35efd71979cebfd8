import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { LASER_KINDS, LASER_KIND_LABELS, materialInputSchema, type MaterialInput, type MaterialView } from '#shared/schemas/catalog.ts';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { SelectField, TextAreaField } from '#src/components/ui/field.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { serverErrorOf, showServerError } from '#src/lib/form-errors.ts';
import { useCreateMaterial, useUpdateMaterial } from '../api/catalog.ts';
import { familyOptions, toneOptions } from '../labels.ts';

type FormValues = z.input<typeof materialInputSchema>;
const NEW: FormValues = {
  name: '',
  family: 'wood',
  surfaceColour: '#c9a77c',
  markColour: '#5b3b22',
  defaultTone: 'positive',
  linesPerInchMin: 250,
  linesPerInchMax: 330,
  safetyNotes: '',
  forbiddenOn: [],
  forbiddenReason: '',
};

/** Adds or edits a material. The list behind shows an edit as soon as it is saved. */
export function MaterialDialog({ slug, material, onClose }: { slug: string; material?: MaterialView; onClose(): void }) {
  const create = useCreateMaterial(slug);
  const update = useUpdateMaterial(slug);
  const toast = useToast();
  const { blankCount: _count, id: _id, ...current } = material ?? { ...NEW, id: '', blankCount: 0 };
  const form = useForm<FormValues, unknown, MaterialInput>({ resolver: zodResolver(materialInputSchema), defaultValues: current });
  const { register, formState } = form;
  const errors = formState.errors;

  const onSubmit = form.handleSubmit(async (input) => {
    try {
      if (material) await update.mutateAsync({ id: material.id, input });
      else await create.mutateAsync(input);
      toast.show(material ? `${input.name} saved.` : `${input.name} added to the materials.`, 'success');
      onClose();
    } catch (error) {
      showServerError(form, error);
    }
  });

  return (
    <Dialog
      open
      title={material ? `Edit ${material.name}` : 'New material'}
      onClose={onClose}
      onSubmit={onSubmit}
      confirm={{ label: material ? 'Save material' : 'Add material', busy: formState.isSubmitting }}
      wide
    >
      <div className="grid gap-4 sm:grid-cols-2">
        {serverErrorOf(form) && (
          <div className="sm:col-span-2">
            <Notice tone="error">{serverErrorOf(form)}</Notice>
          </div>
        )}
        <TextField label="Name" {...register('name')} error={errors.name?.message} className="sm:col-span-2" />
        <SelectField label="Family" options={familyOptions} {...register('family')} error={errors.family?.message} />
        <SelectField
          label="Usual tone"
          options={toneOptions}
          {...register('defaultTone')}
          error={errors.defaultTone?.message}
          hint="Negative where the laser marks lighter than the surface."
        />
        <TextField
          label="Surface colour"
          type="color"
          {...register('surfaceColour')}
          error={errors.surfaceColour?.message}
          hint="The blank before burning, for the mock-up."
        />
        <TextField
          label="Mark colour"
          type="color"
          {...register('markColour')}
          error={errors.markColour?.message}
          hint="The colour a burn leaves on it."
        />
        <TextField
          label="Lowest line density"
          type="number"
          inputMode="numeric"
          suffix="lpi"
          {...register('linesPerInchMin', { valueAsNumber: true })}
          error={errors.linesPerInchMin?.message}
        />
        <TextField
          label="Highest line density"
          type="number"
          inputMode="numeric"
          suffix="lpi"
          {...register('linesPerInchMax', { valueAsNumber: true })}
          error={errors.linesPerInchMax?.message}
        />
        <TextAreaField
          label="Safety notes"
          {...register('safetyNotes')}
          error={errors.safetyNotes?.message}
          className="sm:col-span-2"
          hint="Shown with recipes and on job sheets."
        />
        <fieldset className="flex flex-col gap-2 sm:col-span-2">
          <legend className="mb-1 text-sm font-semibold text-graphite-800">Never engrave on</legend>
          <div className="flex flex-wrap gap-4">
            {LASER_KINDS.map((kind) => (
              <label key={kind} className="flex items-center gap-2 text-sm">
                <input type="checkbox" value={kind} {...register('forbiddenOn')} className="size-5 accent-rust-600" />
                {LASER_KIND_LABELS[kind]} lasers
              </label>
            ))}
          </div>
        </fieldset>
        <TextAreaField
          label="Why not"
          rows={2}
          {...register('forbiddenReason')}
          error={errors.forbiddenReason?.message}
          className="sm:col-span-2"
          hint="Needed when a laser kind is ticked: what burning it would release or damage."
        />
      </div>
    </Dialog>
  );
}
