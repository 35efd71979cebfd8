import { z } from 'zod';
import { ITEM_STAGES, ORDER_STATUSES } from '../orders/stages.ts';
import { burnLookSchema, inscriptionSchema, orderViewSchema, placementSchema } from './checkout.ts';
import { buyerPhotoSchema } from './photos.ts';
import { prepSettingsSchema, prepVersionSchema } from './prep.ts';

/** The workspace's order lists, the photo review queue and the moves staff make on items. */
export const orderListQuerySchema = z.object({
  search: z.string().trim().max(100).default(''),
  stage: z.enum(ITEM_STAGES).optional(),
  status: z.enum(ORDER_STATUSES).optional(),
  material: z.string().trim().max(80).optional(),
  from: z.iso.date('Use a date like 2026-12-01.').optional(),
  to: z.iso.date('Use a date like 2026-12-01.').optional(),
  sort: z.enum(['newest', 'oldest', 'total-high', 'total-low']).default('newest'),
  page: z.coerce.number().int().min(1).default(1),
  pageSize: z.coerce.number().int().min(5).max(100).default(25),
});
export type OrderListQuery = z.input<typeof orderListQuerySchema>;

export const orderListSchema = z.object({
  orders: z.array(
    z.object({
      id: z.uuid(),
      number: z.number().int(),
      createdAt: z.string(),
      status: z.enum(ORDER_STATUSES),
      buyerName: z.string(),
      buyerEmail: z.string(),
      total: z.string(),
      items: z.array(z.object({ id: z.uuid(), stage: z.enum(ITEM_STAGES), label: z.string() })),
    }),
  ),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type OrderList = z.infer<typeof orderListSchema>;

export const REVIEW_REASONS = {
  low_resolution: 'Resolution too low for the size',
  blurry: 'Blurred or out of focus',
  cut_off: 'The subject is cut off',
  other: 'Something else',
} as const;
export type ReviewReason = keyof typeof REVIEW_REASONS;

export const askNewPhotoInputSchema = z.object({
  reason: z.enum(Object.keys(REVIEW_REASONS) as [ReviewReason, ...ReviewReason[]], { error: 'Choose a reason.' }),
  note: z.string().trim().max(500, 'Use at most 500 characters.').default(''),
});
export type AskNewPhotoInput = z.input<typeof askNewPhotoInputSchema>;

export const reviewItemSchema = z.object({
  itemId: z.uuid(),
  orderId: z.uuid(),
  orderNumber: z.number().int(),
  paidAt: z.string().nullable(),
  buyerName: z.string(),
  blankName: z.string(),
  sizeLabel: z.string(),
  areaWidthMm: z.number(),
  areaHeightMm: z.number(),
  /** The blank's shape and colours, so the photo is reviewed in the piece's own outline. */
  look: burnLookSchema,
  effectivePpi: z.number().int(),
  verdict: z.enum(['good', 'fair', 'too-low']),
  lowResolutionConfirmed: z.boolean(),
  placement: placementSchema,
  /** The buyer's lettering, reviewed with the photo (it burns under it). */
  inscription: inscriptionSchema.nullable(),
  photo: buyerPhotoSchema.extend({ originalUrl: z.string() }),
  replacements: z.number().int(),
});
export type ReviewItem = z.infer<typeof reviewItemSchema>;
export const reviewQueueSchema = z.object({ items: z.array(reviewItemSchema) });

/** An item waiting to be prepared: approved photos and proofs sent back for changes. */
export const prepQueueItemSchema = z.object({
  itemId: z.uuid(),
  orderId: z.uuid(),
  orderNumber: z.number().int(),
  buyerName: z.string(),
  label: z.string(),
  stage: z.enum(['prep', 'changes_requested']),
  since: z.string(),
  thumbUrl: z.string(),
});
export type PrepQueueItem = z.infer<typeof prepQueueItemSchema>;
export const prepQueueSchema = z.object({ items: z.array(prepQueueItemSchema) });

/** The staff view of an order: the buyer's view plus who did what and the private details. */
export const staffOrderSchema = orderViewSchema.extend({ paymentIntentId: z.string().nullable() });

/** A buyer's replacement photo, by the private link from the e-mail. */
export const replacementViewSchema = z.object({
  orderNumber: z.number().int(),
  blankName: z.string(),
  sizeLabel: z.string(),
  reason: z.string(),
  note: z.string(),
  item: orderViewSchema.shape.items.element,
});
export const replacementInputSchema = z.object({
  photoId: z.uuid('Upload a photo first.'),
  placement: placementSchema,
  rightsConfirmed: z.literal(true, { error: 'Confirm that you may use this photo.' }),
});
export type ReplacementInput = z.input<typeof replacementInputSchema>;

/** A refund, whole (no amount) or part (an amount in minor units); owners only. */
export const refundInputSchema = z.object({
  amountMinor: z
    .number({ error: 'Enter the amount.' })
    .int('Use whole minor units (cents).')
    .positive('Refund more than nothing.')
    .optional(),
  reason: z.string().trim().min(1, 'Say why, for the buyer and the record.').max(300, 'Use at most 300 characters.'),
});
export type RefundInput = z.input<typeof refundInputSchema>;
export const cancelInputSchema = z.object({
  reason: z.string().trim().min(1, 'Say why, for the buyer and the record.').max(300, 'Use at most 300 characters.'),
});

/** The workspace's first page: work waiting by stage, the oldest waiting items, the last weeks. */
export const todaySchema = z.object({
  byStage: z.array(z.object({ stage: z.enum(ITEM_STAGES), count: z.number().int() })),
  oldest: z.array(
    z.object({
      itemId: z.uuid(),
      orderId: z.uuid(),
      orderNumber: z.number().int(),
      label: z.string(),
      stage: z.enum(ITEM_STAGES),
      since: z.string(),
    }),
  ),
  weeks: z.array(z.object({ weekStart: z.string(), orders: z.number().int(), revenueMinor: z.number().int() })),
  currency: z.string(),
});
export type Today = z.infer<typeof todaySchema>;

/** One item as staff work on it: the buyer's view of it, where it may go next, and its prep. */
export const staffItemSchema = z.object({
  orderId: z.uuid(),
  orderNumber: z.number().int(),
  item: orderViewSchema.shape.items.element,
  allowedMoves: z.array(z.enum(ITEM_STAGES)),
  prep: prepSettingsSchema,
  defaults: prepSettingsSchema,
  versions: z.array(prepVersionSchema),
});
export type StaffItem = z.infer<typeof staffItemSchema>;

/** The buyer's proof: the item, its prep, and the proof image the server rendered. */
export const proofViewSchema = z.object({
  orderNumber: z.number().int(),
  item: orderViewSchema.shape.items.element,
  prep: prepSettingsSchema,
  imageUrl: z.string(),
});
