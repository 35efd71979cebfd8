import { useForm } from 'react-hook-form';
import { sizeInputSchema, type BlankShape, type SizeInput, type SizeView } from '#shared/schemas/catalog.ts';
import { sizeFit } from '#shared/imaging/shape.ts';
import { Button } from '#src/components/ui/button.tsx';
import { moneyInputValue, parseMoneyInput } from '#shared/money.ts';
import { mmToUnit, mmToUnitDown, unitToMm, type LengthUnit } from '#shared/units.ts';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { SelectField } from '#src/components/ui/field.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { convertingResolver } from '#src/lib/converting-resolver.ts';
import { serverErrorOf, showServerError } from '#src/lib/form-errors.ts';
import { useAddSize, useUpdateSize } from '../api/catalog.ts';
import { orientationOptions } from '../labels.ts';

/** Lengths in the studio's unit, the price as typed, stock as a count or unlimited. */
type FormValues = {
  label: string;
  outerWidthMm: number;
  outerHeightMm: number;
  areaWidthMm: number;
  areaHeightMm: number;
  orientation: SizeInput['orientation'];
  priceMinor: string;
  unlimited: boolean;
  stock: number;
  sku: string;
};

export function SizeDialog({
  slug,
  blankId,
  shape,
  units,
  currency,
  size,
  onClose,
}: {
  slug: string;
  blankId: string;
  shape: BlankShape;
  units: LengthUnit;
  currency: string;
  size?: SizeView;
  onClose(): void;
}) {
  const add = useAddSize(slug, blankId);
  const update = useUpdateSize(slug, blankId);
  const toast = useToast();
  const show = (mm: number) => mmToUnit(mm, units);
  const form = useForm<FormValues, unknown, SizeInput>({
    resolver: convertingResolver(sizeInputSchema, (v: FormValues) => ({
      label: v.label,
      outerWidthMm: unitToMm(v.outerWidthMm, units),
      // A round blank has one measure, its diameter, asked once.
      outerHeightMm: unitToMm(shape === 'circle' ? v.outerWidthMm : v.outerHeightMm, units),
      areaWidthMm: unitToMm(v.areaWidthMm, units),
      areaHeightMm: unitToMm(v.areaHeightMm, units),
      orientation: v.orientation,
      priceMinor: parseMoneyInput(v.priceMinor, currency) ?? Number.NaN,
      stock: v.unlimited ? null : v.stock,
      sku: v.sku,
    })),
    defaultValues: size
      ? {
          label: size.label,
          outerWidthMm: show(size.outerWidthMm),
          outerHeightMm: show(size.outerHeightMm),
          areaWidthMm: show(size.areaWidthMm),
          areaHeightMm: show(size.areaHeightMm),
          orientation: size.orientation,
          priceMinor: moneyInputValue(size.priceMinor, currency),
          unlimited: size.stock === null,
          stock: size.stock ?? 0,
          sku: size.sku,
        }
      : {
          label: '',
          orientation: 'either',
          priceMinor: '',
          unlimited: true,
          stock: 0,
          sku: '',
          outerWidthMm: Number.NaN,
          outerHeightMm: Number.NaN,
          areaWidthMm: Number.NaN,
          areaHeightMm: Number.NaN,
        },
  });
  const { register, formState, watch } = form;
  const errors = formState.errors;
  const length = { type: 'number', inputMode: 'decimal', step: 'any', suffix: units } as const;
  // The area checked against the blank's outline as it is typed (the server checks it again):
  // when it reaches past the edge, the largest area of its proportions is offered, rounded down.
  const [outerW, outerH, areaW, areaH] = watch(['outerWidthMm', 'outerHeightMm', 'areaWidthMm', 'areaHeightMm']).map((v) =>
    unitToMm(v, units),
  );
  const typed = [outerW, shape === 'circle' ? outerW : outerH, areaW, areaH];
  const fit = typed.every((v) => v !== undefined && Number.isFinite(v) && v > 0)
    ? sizeFit(shape, { outerWidthMm: typed[0]!, outerHeightMm: typed[1]!, areaWidthMm: typed[2]!, areaHeightMm: typed[3]! })
    : undefined;
  const down = (mm: number) => mmToUnitDown(mm, units);
  const useLargest = () => {
    if (!fit) return;
    form.setValue('areaWidthMm', down(fit.largest.widthMm), { shouldValidate: true });
    form.setValue('areaHeightMm', down(fit.largest.heightMm), { shouldValidate: true });
  };

  const onSubmit = form.handleSubmit(async (input) => {
    try {
      if (size) await update.mutateAsync({ id: size.id, input });
      else await add.mutateAsync(input);
      toast.show(`Size ${input.label} saved.`, 'success');
      onClose();
    } catch (error) {
      showServerError(form, error);
    }
  });

  return (
    <Dialog
      open
      title={size ? `Edit size ${size.label}` : 'New size'}
      onClose={onClose}
      onSubmit={onSubmit}
      confirm={{ label: 'Save size', busy: formState.isSubmitting }}
      wide
    >
      <div className="grid gap-4 sm:grid-cols-2">
        {serverErrorOf(form) && (
          <div className="sm:col-span-2">
            <Notice tone="error">{serverErrorOf(form)}</Notice>
          </div>
        )}
        <TextField
          label="Label"
          {...register('label')}
          error={errors.label?.message}
          hint={units === 'in' ? 'Such as 8 × 10 in.' : 'Such as 200 × 250 mm.'}
        />
        <SelectField label="Orientation" options={orientationOptions} {...register('orientation')} error={errors.orientation?.message} />
        {shape === 'circle' ? (
          <TextField
            label="Blank diameter"
            {...length}
            {...register('outerWidthMm', { valueAsNumber: true })}
            error={errors.outerWidthMm?.message ?? errors.outerHeightMm?.message}
          />
        ) : (
          <>
            <TextField
              label={shape === 'oval' ? 'Blank width (the oval across)' : 'Blank width'}
              {...length}
              {...register('outerWidthMm', { valueAsNumber: true })}
              error={errors.outerWidthMm?.message}
            />
            <TextField
              label={shape === 'oval' ? 'Blank height (the oval top to bottom)' : 'Blank height'}
              {...length}
              {...register('outerHeightMm', { valueAsNumber: true })}
              error={errors.outerHeightMm?.message}
            />
          </>
        )}
        <TextField
          label="Engraving area width"
          {...length}
          {...register('areaWidthMm', { valueAsNumber: true })}
          error={errors.areaWidthMm?.message}
          hint="The part the photo is burned on."
        />
        <TextField
          label="Engraving area height"
          {...length}
          {...register('areaHeightMm', { valueAsNumber: true })}
          error={errors.areaHeightMm?.message}
        />
        {fit && !fit.fits && shape !== 'rectangle' && (
          <div className="sm:col-span-2">
            <Notice tone="caution" title="The area reaches past the blank’s edge">
              <span className="flex flex-wrap items-center gap-3">
                <span>
                  The largest area of these proportions that fits this{' '}
                  {shape === 'circle' ? 'round' : shape === 'oval' ? 'oval' : 'rounded'} blank is {down(fit.largest.widthMm)} ×{' '}
                  {down(fit.largest.heightMm)} {units}.
                </span>
                <Button size="sm" variant="secondary" onClick={useLargest}>
                  Use {down(fit.largest.widthMm)} × {down(fit.largest.heightMm)} {units}
                </Button>
              </span>
            </Notice>
          </div>
        )}
        <TextField label="Price" inputMode="decimal" suffix={currency} {...register('priceMinor')} error={errors.priceMinor?.message} />
        <TextField label="SKU" {...register('sku')} error={errors.sku?.message} hint="Your own stock code; optional." />
        <fieldset className="flex flex-col gap-2 sm:col-span-2">
          <legend className="mb-1 text-sm font-semibold text-graphite-800">Stock</legend>
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...register('unlimited')} className="size-5 accent-ember-500" />
            Unlimited (made to order)
          </label>
          {!watch('unlimited') && (
            <TextField
              label="Blanks in stock"
              type="number"
              inputMode="numeric"
              {...register('stock', { valueAsNumber: true })}
              error={errors.stock?.message}
              className="max-w-48"
            />
          )}
        </fieldset>
      </div>
    </Dialog>
  );
}
