import type { OrderView } from '#shared/schemas/checkout.ts';

/** One line on how an item left: carrier and tracking, or pickup, and when. */
export function handoverLine(handover: NonNullable<OrderView['items'][number]['handover']>): string {
  const when = new Date(handover.at).toLocaleDateString();
  return handover.method === 'ship'
    ? `Shipped with ${handover.carrier}, tracking ${handover.trackingNumber}, on ${when}`
    : `Picked up on ${when}`;
}
