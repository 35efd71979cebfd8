import { useState } from 'react';
import { parseMoneyInput } from '#shared/money.ts';
import type { OrderView } from '#shared/schemas/checkout.ts';
import { Button } from '#src/components/ui/button.tsx';
import { Dialog } from '#src/components/ui/dialog.tsx';
import { TextAreaField } from '#src/components/ui/field.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { TextField } from '#src/components/ui/text-field.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { useCancelOrder, useRefund } from '../api/orders.ts';

/** Owners' refund and cancel buttons on an order, each behind a dialog that asks why. */
export function MoneyActions({ slug, order }: { slug: string; order: OrderView }) {
  const refund = useRefund(slug, order.id);
  const cancel = useCancelOrder(slug, order.id);
  const toast = useToast();
  const [open, setOpen] = useState<'refund' | 'cancel'>();
  const [amount, setAmount] = useState('');
  const [reason, setReason] = useState('');
  const [error, setError] = useState<string>();
  const refundable = order.status === 'paid' || order.status === 'fulfilled';
  const cancellable = order.status === 'awaiting_payment' || order.status === 'paid';

  async function submit() {
    setError(undefined);
    const amountMinor = amount.trim() ? parseMoneyInput(amount, order.currency) : undefined;
    if (amount.trim() && amountMinor === undefined) return setError(`Enter an amount in ${order.currency}, such as 10.00.`);
    try {
      if (open === 'refund') await refund.mutateAsync({ amountMinor, reason });
      else await cancel.mutateAsync({ reason });
      toast.show(open === 'refund' ? 'Refund sent; the buyer has an e-mail.' : 'Order cancelled; the buyer has an e-mail.', 'success');
      setOpen(undefined);
      setAmount('');
      setReason('');
    } catch (e) {
      setError((e as Error).message);
    }
  }

  if (!refundable && !cancellable) return null;
  return (
    <div className="flex gap-2">
      {refundable && (
        <Button variant="secondary" onClick={() => setOpen('refund')}>
          Refund
        </Button>
      )}
      {cancellable && (
        <Button variant="danger" onClick={() => setOpen('cancel')}>
          Cancel order
        </Button>
      )}
      <Dialog
        open={Boolean(open)}
        title={open === 'refund' ? `Refund order ${order.number}` : `Cancel order ${order.number}`}
        onClose={() => setOpen(undefined)}
        onSubmit={(e) => {
          e.preventDefault();
          void submit();
        }}
        confirm={{
          label: open === 'refund' ? 'Send the refund' : 'Cancel the order',
          danger: open === 'cancel',
          busy: refund.isPending || cancel.isPending,
        }}
      >
        <div className="flex flex-col gap-4">
          {error && <Notice tone="error">{error}</Notice>}
          {open === 'refund' && (
            <TextField
              label="Amount"
              inputMode="decimal"
              suffix={order.currency}
              value={amount}
              onChange={(e) => setAmount(e.target.value)}
              hint={`Leave empty to refund all that is left of ${order.total}.`}
            />
          )}
          {open === 'cancel' && <p>Items not yet being engraved are cancelled, their stock goes back, and what was paid is refunded.</p>}
          <TextAreaField label="Reason (the buyer sees it)" value={reason} onChange={(e) => setReason(e.target.value)} maxLength={300} />
        </div>
      </Dialog>
    </div>
  );
}
