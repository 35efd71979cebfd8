import { useState, type FormEvent } from 'react';
import type { OrderView } from '#shared/schemas/checkout.ts';
import { shipInputSchema } from '#shared/schemas/production.ts';
import { Button } from '#src/components/ui/button.tsx';
import { Card, CardTitle } from '#src/components/ui/card.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { useHandOver } from '../api/production.ts';
import { useChosen } from '#src/lib/use-chosen.ts';

/**
 * Burned items leave the studio: in a parcel with the carrier and tracking number, or handed to
 * the buyer at the counter. The buyer is e-mailed either way.
 */
export function HandoverForm({ slug, order }: { slug: string; order: OrderView }) {
  const ready = order.items.filter((item) => item.stage === 'burned');
  const { chosen, toggle } = useChosen(ready.map((i) => i.id));
  const [method, setMethod] = useState<'ship' | 'pickup'>(order.delivery.method);
  const [carrier, setCarrier] = useState('');
  const [trackingNumber, setTrackingNumber] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const handOver = useHandOver(slug, order.id);
  const toast = useToast();
  if (!ready.length) return null;

  function submit(event: FormEvent) {
    event.preventDefault();
    const itemIds = ready.filter((i) => chosen.has(i.id)).map((i) => i.id);
    const parsed = shipInputSchema.safeParse(method === 'ship' ? { method, itemIds, carrier, trackingNumber } : { method, itemIds });
    if (!parsed.success) return setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])));
    setErrors({});
    handOver.mutate(parsed.data, {
      onSuccess: () =>
        toast.show(
          method === 'ship' ? 'Marked shipped; the buyer has the tracking number.' : 'Marked picked up; the buyer has been told.',
          'success',
        ),
      onError: (e) => toast.show(e.message, 'error'),
    });
  }

  return (
    <Card>
      <CardTitle>Hand over</CardTitle>
      <form onSubmit={submit} className="flex flex-col gap-4" noValidate>
        <fieldset className="flex flex-col gap-1 text-sm">
          <legend className="mb-1 font-semibold">Burned and ready</legend>
          {ready.map((item) => (
            <label key={item.id} className="flex items-center gap-2">
              <input type="checkbox" className="size-4" checked={chosen.has(item.id)} onChange={() => toggle(item.id)} />
              {item.blankName}, {item.sizeLabel}
            </label>
          ))}
          {errors.itemIds && <span className="text-rust-600">{errors.itemIds}</span>}
        </fieldset>
        <fieldset className="flex flex-wrap gap-4 text-sm">
          <legend className="mb-1 font-semibold">How</legend>
          <label className="flex items-center gap-2">
            <input type="radio" name="method" checked={method === 'ship'} onChange={() => setMethod('ship')} /> Shipped
          </label>
          <label className="flex items-center gap-2">
            <input type="radio" name="method" checked={method === 'pickup'} onChange={() => setMethod('pickup')} /> Picked up at the studio
          </label>
        </fieldset>
        {method === 'ship' && (
          <div className="grid gap-3 sm:grid-cols-2">
            <TextField
              label="Carrier"
              value={carrier}
              onChange={(e) => setCarrier(e.target.value)}
              error={errors.carrier}
              autoComplete="off"
            />
            <TextField
              label="Tracking number"
              value={trackingNumber}
              onChange={(e) => setTrackingNumber(e.target.value)}
              error={errors.trackingNumber}
              autoComplete="off"
            />
          </div>
        )}
        {order.delivery.method === 'pickup' && method === 'ship' && (
          <Notice tone="caution">The buyer chose pickup; ship only if they asked you to.</Notice>
        )}
        <div>
          <Button type="submit" busy={handOver.isPending}>
            {method === 'ship' ? 'Mark shipped and tell the buyer' : 'Mark picked up and tell the buyer'}
          </Button>
        </div>
      </form>
    </Card>
  );
}
