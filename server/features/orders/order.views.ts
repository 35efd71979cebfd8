import { formatMoney } from '#shared/money.ts';
import { assetPaths, workspacePaths } from '#shared/routes.ts';
import { orientedArea } from '#shared/imaging/sizing.ts';
import type { HalftoneMethod } from '#shared/imaging/halftone/halftone.ts';
import type { BurnLook, OrderView } from '#shared/schemas/checkout.ts';
import type { Order, OrderItem } from './order.entity.ts';

/** The halftone the mock-up uses when a material has no recipe yet: its usual tone and density. */
export const DEFAULT_LOOK_METHOD: HalftoneMethod = 'jarvis-judice-ninke';

export function lookOf(item: OrderItem): BurnLook {
  const { blank, size, recipe } = item.snapshot;
  const area = orientedArea(size, item.orientation);
  return {
    shape: blank.shape,
    surfaceColour: blank.material.surfaceColour,
    markColour: blank.material.markColour,
    tone: recipe?.tone ?? blank.material.defaultTone,
    halftoneMethod: (recipe?.halftoneMethod as HalftoneMethod | undefined) ?? DEFAULT_LOOK_METHOD,
    linesPerInch: recipe?.linesPerInch ?? blank.material.linesPerInchMax,
    areaWidthMm: area.widthMm,
    areaHeightMm: area.heightMm,
  };
}

/** Where staff open an order in the workspace (the job sheet's QR code and audit lines point here). */
export const workspaceOrderPath = workspacePaths.order;

export function orderView(order: Order): OrderView {
  const money = (minor: number) => formatMoney(minor, order.currency);
  const slug = order.studio.slug;
  return {
    id: order.id,
    number: order.number,
    status: order.status,
    createdAt: order.createdAt.toISOString(),
    paidAt: order.paidAt?.toISOString() ?? null,
    currency: order.currency,
    subtotal: money(order.subtotalMinor),
    shipping: money(order.shippingMinor),
    total: money(order.totalMinor),
    refunded: order.refundedMinor ? money(order.refundedMinor) : null,
    buyer: { name: order.buyerName, email: order.buyerEmail },
    delivery: {
      method: order.deliveryMethod,
      label: order.deliveryMethod === 'pickup' ? 'Pickup at the studio' : (order.shippingRate?.name ?? 'Shipping'),
      address: order.shippingAddress,
    },
    note: order.note,
    items: order.items.getItems().map((item) => ({
      id: item.id,
      stage: item.stage,
      blankName: item.snapshot.blank.name,
      sizeLabel: item.snapshot.size.label,
      materialName: item.snapshot.blank.material.name,
      quantity: item.quantity,
      unitPrice: money(item.unitPriceMinor),
      photo: {
        id: item.photo.id,
        previewUrl: assetPaths.buyerPhotoPreview(slug, item.photo.id),
        previewWidth: item.photo.previewWidth,
        previewHeight: item.photo.previewHeight,
        width: item.photo.width,
        height: item.photo.height,
      },
      placement: item.placement,
      orientation: item.orientation,
      inscription: item.inscription,
      look: lookOf(item),
      handover: item.handover,
    })),
    events: order.events
      .getItems()
      .sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime())
      .map((e) => ({ at: e.createdAt.toISOString(), text: e.text })),
  };
}

/**
 * What the buyer reads of an order's timeline: the steps that concern them, in the studio's voice
 * and without the names of its staff. Internal work (saved prep versions, renders, batches) is
 * left out; the workspace shows the whole timeline.
 */
const BUYER_WORDS: Record<string, string | null> = {
  placed: 'Order placed.',
  paid: 'Payment received.',
  payment_failed: 'A payment attempt did not go through.',
  expired: 'The time to pay ran out; nothing was charged.',
  sold_out: 'A piece sold out while you paid: your payment was refunded in full.',
  late_payment_refunded: 'Your payment arrived after the order had lapsed: it was refunded in full.',
  photo_approved: 'Your photo was checked: it will engrave well.',
  new_photo_asked: 'The studio asked you for another photo.',
  new_photo_received: 'Your new photo arrived; the studio is checking it.',
  proof_sent: 'A proof was sent to you.',
  proof_approved: 'You approved the proof.',
  changes_requested: 'You asked for changes to the proof.',
  approved: 'Approved for engraving.',
  prep_reopened: 'Being prepared again.',
  in_production: 'Being engraved.',
  out_of_batch: null,
  burned: 'Engraved.',
  shipped: 'On its way to you.',
  picked_up: 'Collected from the studio.',
  fulfilled: 'Complete: everything has left the studio.',
  refunded: 'Money refunded to you.',
  cancelled: 'Order cancelled.',
  prep_saved: null,
  rendered: null,
};

export function buyerOrderView(order: Order): OrderView {
  const view = orderView(order);
  const events = order.events
    .getItems()
    .sort((a, b) => a.createdAt.getTime() - b.createdAt.getTime())
    .flatMap((e) => {
      const words = BUYER_WORDS[e.type];
      // A step with no buyer's words yet is left out rather than shown in staff words.
      return words ? [{ at: e.createdAt.toISOString(), text: words }] : [];
    });
  return { ...view, events };
}
