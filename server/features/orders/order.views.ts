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

/** An order as its buyer sees it on the private order page. */
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
