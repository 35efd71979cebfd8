import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import {
  LASER_KIND_LABELS,
  SPEED_UNIT_LABELS,
  recipeInputSchema,
  type MachineView,
  type MaterialView,
  type RecipeInput,
  type RecipeView,
} from '#shared/schemas/catalog.ts';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { SelectField, TextAreaField } from '#src/components/ui/field.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { serverErrorOf, showServerError } from '#src/lib/form-errors.ts';
import { useCreateRecipe, useUpdateRecipe } from '../api/catalog.ts';
import { methodOptions, toneOptions } from '../labels.ts';
import { LaserCautions } from './laser-cautions.tsx';

type FormValues = z.input<typeof recipeInputSchema>;

/**
 * Writes how one material burns on one machine. Choosing a material fills in its usual tone and
 * line density for a new recipe; a material forbidden on the machine's laser kind is flagged
 * here and refused by the server with the reason.
 */
export function RecipeDialog({
  slug,
  recipe,
  materials,
  machines,
  onClose,
}: {
  slug: string;
  recipe?: RecipeView;
  materials: MaterialView[];
  machines: MachineView[];
  onClose(): void;
}) {
  const create = useCreateRecipe(slug);
  const update = useUpdateRecipe(slug);
  const toast = useToast();
  const defaults: FormValues = recipe
    ? {
        materialId: recipe.materialId,
        machineId: recipe.machineId,
        linesPerInch: recipe.linesPerInch,
        halftoneMethod: recipe.halftoneMethod,
        tone: recipe.tone,
        speed: recipe.speed,
        powerMinPercent: recipe.powerMinPercent,
        powerMaxPercent: recipe.powerMaxPercent,
        passes: recipe.passes,
        notes: recipe.notes,
      }
    : {
        materialId: '',
        machineId: machines[0]?.id ?? '',
        linesPerInch: 300,
        halftoneMethod: 'jarvis-judice-ninke',
        tone: 'negative',
        speed: Number.NaN,
        powerMinPercent: Number.NaN,
        powerMaxPercent: Number.NaN,
        passes: 1,
        notes: '',
      };
  const form = useForm<FormValues, unknown, RecipeInput>({ resolver: zodResolver(recipeInputSchema), defaultValues: defaults });
  const { register, formState, watch, setValue } = form;
  const errors = formState.errors;
  const material = materials.find((m) => m.id === watch('materialId'));
  const machine = machines.find((k) => k.id === watch('machineId'));
  const forbidden = material && machine && material.forbiddenOn.includes(machine.laserKind);

  const materialField = register('materialId', {
    onChange: (event: { target: { value: string } }) => {
      const chosen = materials.find((m) => m.id === event.target.value);
      if (!chosen || recipe) return;
      setValue('tone', chosen.defaultTone);
      setValue('linesPerInch', chosen.linesPerInchMax);
      // Speed and power belong to one material: another one starts them again, not from the last.
      for (const field of ['speed', 'powerMinPercent', 'powerMaxPercent'] as const) setValue(field, Number.NaN);
    },
  });

  const onSubmit = form.handleSubmit(async (input) => {
    try {
      if (recipe) await update.mutateAsync({ id: recipe.id, input });
      else await create.mutateAsync(input);
      toast.show('Recipe saved.', 'success');
      onClose();
    } catch (error) {
      showServerError(form, error);
    }
  });

  return (
    <Dialog
      open
      title={recipe ? `Recipe: ${recipe.material.name} on ${recipe.machine.name}` : 'New recipe'}
      onClose={onClose}
      onSubmit={onSubmit}
      confirm={{ label: 'Save recipe', busy: formState.isSubmitting }}
      wide
    >
      <div className="grid gap-4 sm:grid-cols-2">
        <div className="sm:col-span-2">
          <LaserCautions />
        </div>
        {serverErrorOf(form) && (
          <div className="sm:col-span-2">
            <Notice tone="error">{serverErrorOf(form)}</Notice>
          </div>
        )}
        <SelectField
          label="Material"
          placeholder="Choose a material…"
          options={materials.map((m) => ({
            value: m.id,
            label: m.forbiddenOn.length ? `${m.name} (never on ${m.forbiddenOn.map((k) => LASER_KIND_LABELS[k]).join(', ')})` : m.name,
          }))}
          {...materialField}
          error={errors.materialId?.message}
        />
        <SelectField
          label="Machine"
          placeholder="Choose a machine…"
          options={machines.map((k) => ({ value: k.id, label: `${k.name} (${LASER_KIND_LABELS[k.laserKind]}, ${k.powerWatts} W)` }))}
          {...register('machineId')}
          error={errors.machineId?.message}
        />
        {forbidden && (
          <div className="sm:col-span-2">
            <Notice tone="error" title={`${material.name} must never go on a ${LASER_KIND_LABELS[machine.laserKind]} laser`}>
              {material.forbiddenReason}
            </Notice>
          </div>
        )}
        <TextField
          label="Line density"
          type="number"
          inputMode="numeric"
          suffix="lines per inch"
          {...register('linesPerInch', { valueAsNumber: true })}
          error={errors.linesPerInch?.message}
          hint={
            forbidden
              ? undefined
              : material
                ? `${material.name} usually takes ${material.linesPerInchMin}–${material.linesPerInchMax}.`
                : '100 to 1200.'
          }
        />
        <SelectField
          label="Halftone method"
          options={methodOptions}
          {...register('halftoneMethod')}
          error={errors.halftoneMethod?.message}
        />
        <SelectField label="Tone" options={toneOptions} {...register('tone')} error={errors.tone?.message} />
        <TextField
          label="Speed"
          type="number"
          inputMode="decimal"
          step="any"
          suffix={machine ? SPEED_UNIT_LABELS[machine.speedUnit] : ''}
          {...register('speed', { valueAsNumber: true })}
          error={errors.speed?.message}
        />
        <TextField
          label="Lowest power"
          type="number"
          inputMode="decimal"
          step="any"
          suffix="%"
          {...register('powerMinPercent', { valueAsNumber: true })}
          error={errors.powerMinPercent?.message}
          hint="Used for the lightest tones."
        />
        <TextField
          label="Highest power"
          type="number"
          inputMode="decimal"
          step="any"
          suffix="%"
          {...register('powerMaxPercent', { valueAsNumber: true })}
          error={errors.powerMaxPercent?.message}
          hint="Used for the darkest tones."
        />
        <TextField
          label="Passes"
          type="number"
          inputMode="numeric"
          {...register('passes', { valueAsNumber: true })}
          error={errors.passes?.message}
        />
        <TextAreaField
          label="Notes"
          {...register('notes')}
          error={errors.notes?.message}
          className="sm:col-span-2"
          hint="Focus, air assist, masking, cleaning: anything the operator should know."
        />
      </div>
    </Dialog>
  );
}
