import { useState } from 'react';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { formatMoney, moneyInputValue, parseMoneyInput } from '#shared/money.ts';
import {
  MASTER_RESOLUTIONS,
  orderSettingsInputSchema,
  shippingRateInputSchema,
  type OrderSettingsInput,
  type ShippingRateInput,
  type ShippingRateView,
} from '#shared/studio.ts';
import { Button } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { SelectField, TextAreaField } from '#src/components/ui/field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { Table, TBody, TD, TH, THActions, THead, TR } from '#src/components/ui/table.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { convertingResolver } from '#src/lib/converting-resolver.ts';
import { serverErrorOf, showServerError } from '#src/lib/form-errors.ts';
import type { Workspace } from '../api/get-workspace.ts';
import {
  useAddShippingRate,
  useDeleteShippingRate,
  useShippingRates,
  useUpdateOrderSettings,
  useUpdateShippingRate,
} from '../api/order-settings.ts';

/** How the studio takes orders: what happens to low-resolution photos, pickup, and the master's resolution. */
export function OrderSettingsCard({ workspace }: { workspace: Workspace }) {
  const save = useUpdateOrderSettings(workspace.studio.slug);
  const toast = useToast();
  const form = useForm<OrderSettingsInput>({ resolver: zodResolver(orderSettingsInputSchema), defaultValues: workspace.orders });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (input) => {
    try {
      await save.mutateAsync(input);
      toast.show('Order settings saved.', 'success');
    } catch (error) {
      showServerError(form, error);
    }
  });
  return (
    <Card>
      <CardTitle>Orders, pickup and files</CardTitle>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
        {serverErrorOf(form) && <Notice tone="error">{serverErrorOf(form)}</Notice>}
        <SelectField
          label="A photo too small for its size"
          options={[
            { value: 'confirm', label: 'may be ordered once the buyer confirms' },
            { value: 'refuse', label: 'is refused: the buyer must choose a smaller size' },
          ]}
          {...form.register('lowResolutionPolicy')}
          error={errors.lowResolutionPolicy?.message}
          hint="Too small means under 150 pixels per inch at the chosen size."
        />
        <label className="flex items-center gap-2 text-sm font-semibold">
          <input type="checkbox" {...form.register('pickupEnabled')} className="size-5 accent-ember-500" />
          Buyers may collect their order from the studio
        </label>
        <label className="flex items-center gap-2 text-sm font-semibold">
          <input type="checkbox" {...form.register('proofsRequired')} className="size-5 accent-ember-500" />
          Send every buyer a proof to approve before engraving
        </label>
        <SelectField
          label="Grayscale master"
          options={Object.entries(MASTER_RESOLUTIONS).map(([value, label]) => ({ value, label }))}
          {...form.register('masterResolution')}
          error={errors.masterResolution?.message}
          hint="Each render also writes a grayscale master for machine software that halftones by itself. At 1000 pixels per inch an 8 × 10 in master is about 80 megapixels."
        />
        <TextField
          label="Number of the next order"
          type="number"
          inputMode="numeric"
          min={1}
          className="max-w-48"
          {...form.register('nextOrderNumber', { valueAsNumber: true })}
          error={errors.nextOrderNumber?.message}
          hint="Orders count up from here. Before the first order this is the first number; it cannot go back to a number already used."
        />
        {form.watch('pickupEnabled') && (
          <TextAreaField label="Where and when to collect" rows={2} {...form.register('pickupNote')} error={errors.pickupNote?.message} />
        )}
        <Button type="submit" busy={form.formState.isSubmitting} className="self-start">
          Save order settings
        </Button>
      </form>
    </Card>
  );
}

export function ShippingRatesCard({ workspace }: { workspace: Workspace }) {
  const { slug, currency } = workspace.studio;
  const rates = useShippingRates(slug);
  const remove = useDeleteShippingRate(slug);
  const toast = useToast();
  const [editing, setEditing] = useState<ShippingRateView | 'new'>();
  const [removing, setRemoving] = useState<ShippingRateView>();
  async function confirmRemove() {
    const rate = removing!;
    setRemoving(undefined);
    try {
      await remove.mutateAsync(rate.id);
      toast.show(`${rate.name} removed.`, 'success');
    } catch (error) {
      toast.show((error as Error).message, 'error');
    }
  }
  return (
    <Card>
      <CardTitle
        aside={
          <Button size="sm" onClick={() => setEditing('new')}>
            Add a rate
          </Button>
        }
      >
        Shipping rates
      </CardTitle>
      <p className="mb-4 text-sm text-graphite-600">
        Flat rates per order, offered at checkout. An order keeps the rate it was placed with.
      </p>
      {rates.error && <Notice tone="error">{rates.error.message}</Notice>}
      {rates.data && rates.data.rates.length === 0 && (
        <Notice tone="caution">
          No shipping rates yet:{' '}
          {workspace.orders.pickupEnabled
            ? 'buyers can only collect their orders.'
            : 'buyers cannot check out until you add one or allow pickup.'}
        </Notice>
      )}
      {rates.data && rates.data.rates.length > 0 && (
        <Table>
          <THead>
            <tr>
              <TH>Method</TH>
              <TH>Price</TH>
              <THActions />
            </tr>
          </THead>
          <TBody>
            {rates.data.rates.map((rate) => (
              <TR key={rate.id}>
                <TD className="font-semibold">{rate.name}</TD>
                <TD>{formatMoney(rate.priceMinor, currency)}</TD>
                <TD className="text-right">
                  <Button size="sm" variant="quiet" onClick={() => setEditing(rate)} aria-label={`Edit ${rate.name}`}>
                    Edit
                  </Button>
                  <Button size="sm" variant="quiet" onClick={() => setRemoving(rate)} aria-label={`Remove ${rate.name}`}>
                    Remove
                  </Button>
                </TD>
              </TR>
            ))}
          </TBody>
        </Table>
      )}
      {editing && (
        <RateDialog slug={slug} currency={currency} rate={editing === 'new' ? undefined : editing} onClose={() => setEditing(undefined)} />
      )}
      <Dialog
        open={Boolean(removing)}
        title={`Remove ${removing?.name ?? ''}?`}
        onClose={() => setRemoving(undefined)}
        confirm={{ label: 'Remove rate', danger: true, onConfirm: () => void confirmRemove() }}
      >
        Checkout stops offering it. Orders already placed keep it.
      </Dialog>
    </Card>
  );
}

type RateForm = { name: string; priceMinor: string; sortOrder: number };

function RateDialog({ slug, currency, rate, onClose }: { slug: string; currency: string; rate?: ShippingRateView; onClose(): void }) {
  const add = useAddShippingRate(slug);
  const update = useUpdateShippingRate(slug);
  const toast = useToast();
  const form = useForm<RateForm, unknown, ShippingRateInput>({
    resolver: convertingResolver(shippingRateInputSchema, (v: RateForm) => ({
      ...v,
      priceMinor: parseMoneyInput(v.priceMinor, currency) ?? Number.NaN,
    })),
    defaultValues: rate
      ? { name: rate.name, priceMinor: moneyInputValue(rate.priceMinor, currency), sortOrder: rate.sortOrder }
      : { name: '', priceMinor: '', sortOrder: 0 },
  });
  const errors = form.formState.errors;
  const onSubmit = form.handleSubmit(async (input) => {
    try {
      if (rate) await update.mutateAsync({ id: rate.id, input });
      else await add.mutateAsync(input);
      toast.show(`${input.name} saved.`, 'success');
      onClose();
    } catch (error) {
      showServerError(form, error);
    }
  });
  return (
    <Dialog
      open
      title={rate ? `Edit ${rate.name}` : 'New shipping rate'}
      onClose={onClose}
      onSubmit={onSubmit}
      confirm={{ label: 'Save rate', busy: form.formState.isSubmitting }}
    >
      <div className="flex flex-col gap-4">
        {serverErrorOf(form) && <Notice tone="error">{serverErrorOf(form)}</Notice>}
        <TextField
          label="Method"
          {...form.register('name')}
          error={errors.name?.message}
          hint="What the buyer chooses, with how long it takes."
        />
        <TextField
          label="Price"
          inputMode="decimal"
          suffix={currency}
          {...form.register('priceMinor')}
          error={errors.priceMinor?.message}
        />
        <TextField
          label="Position in the list"
          type="number"
          {...form.register('sortOrder', { valueAsNumber: true })}
          error={errors.sortOrder?.message}
        />
      </div>
    </Dialog>
  );
}
