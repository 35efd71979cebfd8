import type { EntityManager } from '@mikro-orm/postgresql';
import { absolute, storefrontPaths } from '#shared/routes.ts';
import { AppError, type FieldIssue } from '#shared/errors.ts';
import { formatMoney } from '#shared/money.ts';
import { effectivePpi, largestFairOffered, verdictFor } from '#shared/imaging/photo-checks.ts';
import { cropMatchesArea, orientedArea } from '#shared/imaging/sizing.ts';
import type { checkoutInputSchema } from '#shared/schemas/checkout.ts';
import { formatSize } from '#shared/units.ts';
import type { z } from 'zod';
import type { Env } from '#server/env.ts';
import type { BaseEntity } from '#server/db/base.entity.ts';
import type { Payments } from '#server/adapters/payments.ts';
import { newLinkToken } from '#server/lib/tokens.ts';
import { Blank, Recipe } from '#server/features/catalog/catalog.entity.ts';
import { snapshotForOrder } from '#server/features/catalog/catalog.service.ts';
import { findBuyerPhoto } from '#server/features/photos/photos.service.ts';
import { ShippingRate } from '#server/features/shipping/shipping-rate.entity.ts';
import type { Studio } from '#server/features/studios/studio.entity.ts';
import { move } from '#server/features/orders/order-stages.service.ts';
import { mailLines, orderReceivedMail } from '#server/features/orders/order-mail.ts';
import { fromStudio, holdEmail } from '#server/features/outbox/outbox.service.ts';
import { Order, OrderEvent, OrderItem } from '../orders/order.entity.ts';

type CheckoutInput = z.output<typeof checkoutInputSchema>;

/** A checkout session lives a little over the provider's 30-minute minimum. */
const SESSION_SECONDS = 31 * 60;

/** Why a framing of the wrong proportions is refused: placed, it would come out stretched. */
export const stretchedMessage = (crop: { width: number; height: number }, area: { widthMm: number; heightMm: number }) =>
  `The photo’s framing (${Math.round(crop.width)} × ${Math.round(crop.height)} pixels) does not have the proportions of the ${formatSize(area.widthMm, area.heightMm, 'mm')} engraving area, so it would burn stretched. Please place the photo again.`;

const refuse = (path: Array<string | number>, message: string): never => {
  throw new AppError('VALIDATION_FAILED', message, { issues: [{ path, message } satisfies FieldIssue] });
};

/** The recipe a blank burns with: its material's first recipe (any machine), or none yet. */
export const recipeFor = (em: EntityManager, studio: Studio, blank: Blank) =>
  em.findOne(Recipe, { studio, material: blank.material }, { orderBy: { createdAt: 'asc' } });

/**
 * Prices and checks a buyer's order from the catalog alone, writes it awaiting payment with a
 * copy of everything it depends on, and opens a checkout session for exactly that total.
 * Nothing the client says about money is read.
 */
export async function placeOrder(
  em: EntityManager,
  deps: { env: Env; payments: Payments },
  studio: Studio,
  input: CheckoutInput,
): Promise<{ order: Order; paymentUrl: string; accessKey: string }> {
  const units = studio.units;
  const wanted = new Map<string, number>();
  const lines: Array<
    Omit<
      OrderItem,
      | keyof BaseEntity
      | 'studio'
      | 'order'
      | 'stage'
      | 'replacementTokenHash'
      | 'replacementReason'
      | 'replacementNote'
      | 'replacements'
      | 'prepVersions'
      | 'proofTokenHash'
      | 'handover'
      | 'proofImageKey'
      | 'position'
    >
  > = [];
  for (const [index, item] of input.items.entries()) {
    const at = (field: string) => ['items', index, field];
    const blank = await em.findOne(Blank, { id: item.blankId, studio, status: 'active' }, { populate: ['material', 'sizes'] });
    if (!blank) refuse(at('blankId'), 'This blank is no longer for sale. Please remove it from the cart.');
    const size =
      blank!.sizes.getItems().find((s) => s.id === item.sizeId) ??
      refuse(at('sizeId'), `This size of ${blank!.name} is no longer offered. Please choose another.`);
    if (size.orientation !== 'either' && size.orientation !== item.orientation)
      refuse(at('orientation'), `${size.label} is made ${size.orientation} only.`);
    wanted.set(size.id, (wanted.get(size.id) ?? 0) + item.quantity);
    if (size.stock !== null && size.stock < wanted.get(size.id)!) {
      refuse(
        at('quantity'),
        size.stock === 0 ? `${blank!.name}, ${size.label} is sold out.` : `Only ${size.stock} of ${blank!.name}, ${size.label} left.`,
      );
    }
    const photo = await findBuyerPhoto(em, studio, item.photoId);
    const { crop } = item.placement;
    const overlaps = crop.left < photo.width && crop.top < photo.height && crop.left + crop.width > 0 && crop.top + crop.height > 0;
    if (!overlaps || crop.width > 4 * Math.max(photo.width, photo.height))
      refuse(at('placement'), 'The photo is placed outside the engraving area. Please place it again.');
    const area = orientedArea(size, item.orientation);
    if (!cropMatchesArea(crop, area)) refuse(at('placement'), stretchedMessage(crop, area));
    const ppi = effectivePpi(crop, area);
    if (verdictFor(ppi) === 'too-low') {
      const offered = blank!.sizes.getItems().map((s) => ({ ...orientedArea(s, item.orientation), label: s.label }));
      const fair = largestFairOffered(crop, offered);
      const advice = fair ? `Choose ${fair.label} or upload a larger photo.` : 'Please upload a larger photo.';
      const what = `This photo gives only ${Math.floor(ppi)} pixels per inch at ${formatSize(area.widthMm, area.heightMm, units)}, too few for a crisp engraving.`;
      if (studio.lowResolutionPolicy === 'refuse') refuse(at('photoId'), `${what} ${advice}`);
      if (!item.lowResolutionConfirmed)
        refuse(at('lowResolutionConfirmed'), `${what} ${advice} Or confirm that you want it at this size anyway.`);
    }
    const recipe = await recipeFor(em, studio, blank!);
    lines.push({
      size,
      snapshot: snapshotForOrder(blank!, size, recipe),
      quantity: item.quantity,
      unitPriceMinor: size.priceMinor,
      photo,
      placement: item.placement,
      orientation: item.orientation,
      inscription: item.inscription,
      effectivePpi: Math.floor(ppi),
      lowResolutionConfirmed: item.lowResolutionConfirmed,
    });
  }

  let shippingRate: ShippingRate | null = null;
  if (input.delivery.method === 'ship') {
    shippingRate =
      (await em.findOne(ShippingRate, { id: input.delivery.rateId, studio })) ??
      refuse(['delivery', 'rateId'], 'This shipping method is no longer offered. Please choose another.');
  } else if (!studio.pickupEnabled) {
    refuse(['delivery', 'method'], `${studio.name} does not offer pickup. Please choose a shipping method.`);
  }

  const subtotal = lines.reduce((sum, l) => sum + l.unitPriceMinor * l.quantity, 0);
  const shipping = shippingRate?.priceMinor ?? 0;
  const access = newLinkToken();
  const order = await em.transactional(async (tx) => {
    // The studio's row lock hands out order numbers one at a time.
    const [taken] = await tx.execute<Array<{ number: number }>>(
      'update "studio" set "next_order_number" = "next_order_number" + 1 where "id" = ? returning "next_order_number" - 1 as "number"',
      [studio.id],
    );
    const created = tx.create(Order, {
      studio,
      number: taken!.number,
      status: 'awaiting_payment',
      buyerEmail: input.buyer.email,
      buyerName: input.buyer.name,
      deliveryMethod: input.delivery.method,
      shippingAddress: input.delivery.method === 'ship' ? input.delivery.address : null,
      shippingRate: shippingRate && { id: shippingRate.id, name: shippingRate.name, priceMinor: shippingRate.priceMinor },
      currency: studio.currency,
      subtotalMinor: subtotal,
      shippingMinor: shipping,
      totalMinor: subtotal + shipping,
      accessKeyHash: access.hash,
    });
    for (const [position, line] of lines.entries()) tx.create(OrderItem, { ...line, position, studio, order: created, stage: 'unpaid' });
    tx.create(OrderEvent, {
      studio,
      order: created,
      type: 'placed',
      actor: 'buyer',
      text: `Order placed by ${input.buyer.name}; waiting for payment of ${formatMoney(subtotal + shipping, studio.currency)}.`,
    });
    return created;
  });

  const orderUrl = absolute(deps.env.APP_URL, storefrontPaths.order(studio.slug, order.id, access.token));
  try {
    const session = await deps.payments.stripe.checkout.sessions.create(
      {
        mode: 'payment',
        customer_email: order.buyerEmail,
        line_items: [
          ...lines.map((l) => ({
            quantity: l.quantity,
            price_data: {
              currency: studio.currency.toLowerCase(),
              unit_amount: l.unitPriceMinor,
              product_data: { name: `${l.snapshot.blank.name}, ${l.snapshot.size.label}` },
            },
          })),
          ...(shippingRate
            ? [
                {
                  quantity: 1,
                  price_data: {
                    currency: studio.currency.toLowerCase(),
                    unit_amount: shippingRate.priceMinor,
                    product_data: { name: `Shipping: ${shippingRate.name}` },
                  },
                },
              ]
            : []),
        ],
        metadata: { orderId: order.id, studioId: studio.id, shop_name: studio.name },
        payment_intent_data: { metadata: { orderId: order.id, studioId: studio.id } },
        success_url: `${orderUrl}&paid=1`,
        cancel_url: absolute(deps.env.APP_URL, storefrontPaths.cart(studio.slug)),
        expires_at: Math.floor(Date.now() / 1000) + SESSION_SECONDS,
      },
      { idempotencyKey: `checkout-${order.id}` },
    );
    order.checkoutSessionId = session.id;
    // The receipt is written now, while the private link's key is at hand (only its hash is
    // kept), and sent when the payment arrives.
    holdEmail(
      em,
      {
        to: order.buyerEmail,
        ...fromStudio(studio),
        ...orderReceivedMail({
          studioName: studio.name,
          number: order.number,
          buyerName: order.buyerName,
          lines: mailLines(lines, studio.currency),
          total: formatMoney(order.totalMinor, order.currency),
          url: orderUrl,
          delivery: shippingRate
            ? `${shippingRate.name}, ${formatMoney(shippingRate.priceMinor, studio.currency)}`
            : 'Pickup at the studio',
          contact: studio.contactEmail,
        }),
      },
      order.id,
    );
    await em.flush();
    return { order, paymentUrl: session.url!, accessKey: access.token };
  } catch (cause) {
    move(
      em,
      { order, status: 'cancelled', items: 'cancelled' },
      { type: 'cancelled', actor: 'payments', text: 'Payment could not be started; nothing was charged.' },
    );
    order.note = 'Payment could not be started.';
    await em.flush();
    throw new AppError('SERVICE_UNAVAILABLE', 'Payment could not be started just now. Nothing was charged; please try again in a moment.', {
      cause,
    });
  }
}
