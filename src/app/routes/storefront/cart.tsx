import { useEffect, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { AppError } from '#shared/errors.ts';
import { formatMoney } from '#shared/money.ts';
import { checkoutInputSchema } from '#shared/schemas/checkout.ts';
import type { PublicStudio } from '#shared/studio.ts';
import { WithStorefront } from '#src/app/layouts/storefront-layout.tsx';
import { Button, buttonClasses } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { loadCheckoutDetails, saveCheckoutDetails, useCart, type CartLine } from '#src/features/cart/index.ts';
import { placeOrder, useDeliveryOptions } from '#src/features/storefront/api/checkout.ts';

export function CartPage() {
  return <WithStorefront>{(studio) => <Cart studio={studio} />}</WithStorefront>;
}

const detailsSchema = checkoutInputSchema.omit({ items: true });
type Details = z.input<typeof detailsSchema>;
type DetailErrors = {
  buyer?: { email?: { message?: string }; name?: { message?: string } };
  delivery?: { rateId?: { message?: string }; method?: { message?: string }; address?: Record<string, { message?: string } | undefined> };
};

function Cart({ studio }: { studio: PublicStudio }) {
  const { studioSlug = '' } = useParams();
  const cart = useCart(studioSlug);
  const delivery = useDeliveryOptions(studioSlug);
  const [failure, setFailure] = useState<{ message: string; line?: number }>();
  const form = useForm<Details, unknown, z.output<typeof detailsSchema>>({
    resolver: zodResolver(detailsSchema),
    defaultValues: loadCheckoutDetails<Details>(studioSlug, {
      buyer: { email: '', name: '' },
      delivery: { method: 'ship', rateId: '', address: { line1: '', line2: '', city: '', region: '', postalCode: '', country: '' } },
    }),
  });
  // Kept as typed, so that coming back from the payment page finds the form filled in.
  useEffect(() => {
    const subscription = form.watch((values) => saveCheckoutDetails(studioSlug, values));
    return () => subscription.unsubscribe();
  }, [form, studioSlug]);
  const method = form.watch('delivery.method');
  const rateId = form.watch('delivery.rateId' as 'delivery.method') as unknown as string;
  const errors = form.formState.errors as DetailErrors;
  const subtotal = cart.lines.reduce((sum, l) => sum + l.priceMinor * (l.quantity ?? 1), 0);
  const shipping = method === 'ship' ? (delivery.data?.rates.find((r) => r.id === rateId)?.priceMinor ?? 0) : 0;
  // Pickup is free; a shipped order has its price only once a rate is chosen.
  const chosen = method === 'pickup' || Boolean(rateId);
  const money = (minor: number) => formatMoney(minor, studio.currency);

  const onSubmit = form.handleSubmit(async (details) => {
    setFailure(undefined);
    try {
      const items = cart.lines.map(
        ({ lineId: _l, blankName: _b, sizeLabel: _s, priceMinor: _p, thumbUrl: _t, verdict: _v, ...item }) => item,
      );
      const { paymentUrl } = await placeOrder(studioSlug, { ...details, items });
      window.location.assign(paymentUrl);
    } catch (error) {
      const issue = error instanceof AppError ? error.issues?.[0] : undefined;
      setFailure({ message: (error as Error).message, line: issue?.path[0] === 'items' ? Number(issue.path[1]) : undefined });
    }
  });

  if (cart.lines.length === 0)
    return (
      <div className="flex flex-col items-start gap-4">
        <h1 className="text-3xl font-extrabold">Your cart</h1>
        <p className="text-graphite-600">Your cart is empty.</p>
        <Link to={`/s/${studioSlug}`} className={buttonClasses('primary')}>
          Choose something to engrave
        </Link>
      </div>
    );

  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-8 lg:grid-cols-[minmax(0,1fr)_minmax(0,26rem)]">
      <div className="flex flex-col gap-4">
        <h1 className="text-3xl font-extrabold">Your cart</h1>
        <ul className="flex flex-col gap-3">
          {cart.lines.map((line, index) => (
            <CartRow
              key={line.lineId}
              line={line}
              money={money}
              highlighted={failure?.line === index}
              onQuantity={(q) => cart.setQuantity(line.lineId, q)}
              onRemove={() => cart.remove(line.lineId)}
            />
          ))}
        </ul>
        <Link to={`/s/${studioSlug}`} className="inline-block self-start py-1 text-sm font-semibold text-graphite-700 hover:underline">
          ← Continue shopping
        </Link>
      </div>
      <Card>
        <CardTitle>Checkout</CardTitle>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          {failure && <Notice tone="error">{failure.message}</Notice>}
          <TextField
            label="E-mail address"
            type="email"
            autoComplete="email"
            {...form.register('buyer.email')}
            error={errors.buyer?.email?.message}
            hint="We send your receipt and the link to follow your order here."
          />
          <TextField label="Your name" autoComplete="name" {...form.register('buyer.name')} error={errors.buyer?.name?.message} />
          <fieldset className="flex flex-col gap-2">
            <legend className="mb-1 text-sm font-semibold text-graphite-800">Delivery</legend>
            {delivery.data?.rates.map((rate) => (
              <label
                key={rate.id}
                className="flex items-center justify-between gap-2 rounded-lg border border-graphite-200 px-3 py-2 text-sm"
              >
                <span className="flex items-center gap-2">
                  <input
                    type="radio"
                    checked={method === 'ship' && rateId === rate.id}
                    onChange={() => {
                      form.setValue('delivery.method', 'ship');
                      form.setValue('delivery.rateId' as 'delivery.method', rate.id as 'ship');
                    }}
                    className="size-6 shrink-0 accent-[var(--color-accent)]"
                  />
                  {rate.name}
                </span>
                <span className="font-semibold">{rate.price}</span>
              </label>
            ))}
            {delivery.data?.pickup && (
              <label className="flex items-start gap-2 rounded-lg border border-graphite-200 px-3 py-2 text-sm">
                <input
                  type="radio"
                  checked={method === 'pickup'}
                  onChange={() => form.setValue('delivery.method', 'pickup')}
                  className="size-6 shrink-0 accent-[var(--color-accent)]"
                />
                <span>
                  Pick it up at the studio (free)
                  <span className="block text-xs text-graphite-500">{delivery.data.pickup.note}</span>
                </span>
              </label>
            )}
            {(errors.delivery?.rateId?.message ?? errors.delivery?.method?.message) && (
              <p className="text-xs font-semibold text-rust-600">{errors.delivery?.rateId?.message ?? errors.delivery?.method?.message}</p>
            )}
          </fieldset>
          {method === 'ship' && (
            <fieldset className="grid gap-3 sm:grid-cols-2">
              <legend className="mb-1 text-sm font-semibold text-graphite-800">Shipping address</legend>
              <TextField
                label="Street and number"
                autoComplete="address-line1"
                {...form.register('delivery.address.line1' as 'delivery.method')}
                error={errors.delivery?.address?.line1?.message}
                className="sm:col-span-2"
              />
              <TextField
                label="Flat, building (optional)"
                autoComplete="address-line2"
                {...form.register('delivery.address.line2' as 'delivery.method')}
                className="sm:col-span-2"
              />
              <TextField
                label="Town or city"
                autoComplete="address-level2"
                {...form.register('delivery.address.city' as 'delivery.method')}
                error={errors.delivery?.address?.city?.message}
              />
              <TextField
                label="County, state (optional)"
                autoComplete="address-level1"
                {...form.register('delivery.address.region' as 'delivery.method')}
              />
              <TextField
                label="Postcode"
                autoComplete="postal-code"
                {...form.register('delivery.address.postalCode' as 'delivery.method')}
                error={errors.delivery?.address?.postalCode?.message}
              />
              <TextField
                label="Country code"
                autoComplete="country"
                maxLength={2}
                hint="Two letters, such as GB, US or DE."
                {...form.register('delivery.address.country' as 'delivery.method')}
                error={errors.delivery?.address?.country?.message}
              />
            </fieldset>
          )}
          <dl className="grid grid-cols-[1fr_auto] gap-y-1 border-t border-graphite-100 pt-3 text-sm">
            <dt>Items</dt>
            <dd className="text-right">{money(subtotal)}</dd>
            <dt>Delivery</dt>
            <dd className="text-right">{chosen ? money(shipping) : <span className="text-graphite-500">choose a method</span>}</dd>
            <dt className="text-base font-bold">Total</dt>
            <dd className="text-right text-base font-bold">{money(subtotal + shipping)}</dd>
          </dl>
          <Button type="submit" size="lg" busy={form.formState.isSubmitting}>
            Go to payment
          </Button>
          <p className="text-xs text-graphite-500">You pay on the next page. The total is confirmed there from the studio’s own prices.</p>
        </form>
      </Card>
    </div>
  );
}

function CartRow({
  line,
  money,
  highlighted,
  onQuantity,
  onRemove,
}: {
  line: CartLine;
  money: (minor: number) => string;
  highlighted: boolean;
  onQuantity(q: number): void;
  onRemove(): void;
}) {
  const quantity = line.quantity ?? 1;
  return (
    // On a phone the quantity, price and Remove wrap under the photo and its name.
    <li
      className={`flex flex-wrap items-center gap-x-4 gap-y-3 rounded-card border bg-white p-4 ${highlighted ? 'border-rust-600' : 'border-graphite-100'}`}
    >
      <img src={line.thumbUrl} alt="" className="size-20 rounded-md object-cover" />
      <div className="min-w-0 flex-1 basis-40">
        <p className="font-bold">{line.blankName}</p>
        <p className="text-sm text-graphite-600">
          {line.sizeLabel}, {line.orientation}
          {line.inscription ? `, with “${line.inscription.lines.join(' / ')}”` : ''}
        </p>
        {line.verdict === 'too-low' && <p className="text-xs font-semibold text-rust-600">Low resolution: confirmed by you</p>}
      </div>
      <label className="flex flex-col text-xs font-semibold">
        Quantity
        <input
          type="number"
          min={1}
          max={20}
          value={quantity}
          onChange={(e) => onQuantity(Math.min(20, Math.max(1, Number(e.target.value) || 1)))}
          className="h-9 w-16 rounded-lg border border-graphite-200 px-2 text-sm font-normal"
        />
      </label>
      <p className="ml-auto min-w-20 text-right font-bold">{money(line.priceMinor * quantity)}</p>
      <Button size="sm" variant="quiet" onClick={onRemove} aria-label={`Remove ${line.blankName}, ${line.sizeLabel}`}>
        Remove
      </Button>
    </li>
  );
}
