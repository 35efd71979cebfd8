import { useForm } from 'react-hook-form';
import { machineInputSchema, type MachineInput, type MachineView } from '#shared/schemas/catalog.ts';
import { mmToBedUnit, type LengthUnit, unitToMm } from '#shared/units.ts';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { SelectField, TextAreaField } from '#src/components/ui/field.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { convertingResolver } from '#src/lib/converting-resolver.ts';
import { serverErrorOf, showServerError } from '#src/lib/form-errors.ts';
import { useCreateMachine, useUpdateMachine } from '../api/catalog.ts';
import { laserKindOptions, speedUnitOptions } from '../labels.ts';

/** The bed is typed in the studio's unit; the form's values are otherwise the stored ones. */
type FormValues = Omit<MachineInput, 'notes'> & { notes: string };

export function MachineDialog({
  slug,
  units,
  machine,
  onClose,
}: {
  slug: string;
  units: LengthUnit;
  machine?: MachineView;
  onClose(): void;
}) {
  const create = useCreateMachine(slug);
  const update = useUpdateMachine(slug);
  const toast = useToast();
  const stored = machine ?? {
    name: '',
    laserKind: 'co2' as const,
    powerWatts: 60,
    bedWidthMm: 600,
    bedHeightMm: 400,
    speedUnit: 'mm/s' as const,
    notes: '',
  };
  const form = useForm<FormValues, unknown, MachineInput>({
    resolver: convertingResolver(machineInputSchema, (v: FormValues) => ({
      ...v,
      bedWidthMm: unitToMm(v.bedWidthMm, units),
      bedHeightMm: unitToMm(v.bedHeightMm, units),
    })),
    defaultValues: {
      name: stored.name,
      laserKind: stored.laserKind,
      powerWatts: stored.powerWatts,
      speedUnit: stored.speedUnit,
      notes: stored.notes,
      bedWidthMm: mmToBedUnit(stored.bedWidthMm, units),
      bedHeightMm: mmToBedUnit(stored.bedHeightMm, units),
    },
  });
  const { register, formState } = form;
  const errors = formState.errors;

  const onSubmit = form.handleSubmit(async (input) => {
    try {
      if (machine) await update.mutateAsync({ id: machine.id, input });
      else await create.mutateAsync(input);
      toast.show(`${input.name} saved.`, 'success');
      onClose();
    } catch (error) {
      showServerError(form, error);
    }
  });

  return (
    <Dialog
      open
      title={machine ? `Edit ${machine.name}` : 'New machine'}
      onClose={onClose}
      onSubmit={onSubmit}
      confirm={{ label: machine ? 'Save machine' : 'Add machine', busy: formState.isSubmitting }}
      wide
    >
      <div className="grid gap-4 sm:grid-cols-2">
        {serverErrorOf(form) && (
          <div className="sm:col-span-2">
            <Notice tone="error">{serverErrorOf(form)}</Notice>
          </div>
        )}
        <TextField
          label="Name"
          {...register('name')}
          error={errors.name?.message}
          className="sm:col-span-2"
          hint="As the team calls it, such as “Big CO2 by the window”."
        />
        <SelectField label="Laser kind" options={laserKindOptions} {...register('laserKind')} error={errors.laserKind?.message} />
        <TextField
          label="Laser power"
          type="number"
          inputMode="decimal"
          step="any"
          suffix="W"
          {...register('powerWatts', { valueAsNumber: true })}
          error={errors.powerWatts?.message}
        />
        <TextField
          label="Bed width"
          type="number"
          inputMode="decimal"
          step="any"
          suffix={units}
          {...register('bedWidthMm', { valueAsNumber: true })}
          error={errors.bedWidthMm?.message}
        />
        <TextField
          label="Bed depth"
          type="number"
          inputMode="decimal"
          step="any"
          suffix={units}
          {...register('bedHeightMm', { valueAsNumber: true })}
          error={errors.bedHeightMm?.message}
        />
        <SelectField
          label="Speed is set in"
          options={speedUnitOptions}
          {...register('speedUnit')}
          error={errors.speedUnit?.message}
          hint="The unit the machine’s own software uses; recipes give speeds in it."
          className="sm:col-span-2"
        />
        <TextAreaField label="Notes" {...register('notes')} error={errors.notes?.message} className="sm:col-span-2" />
      </div>
    </Dialog>
  );
}
