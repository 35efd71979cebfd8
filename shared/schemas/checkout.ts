import { z } from 'zod';
import { ITEM_STAGES, ORDER_STATUSES } from '../orders/stages.ts';
import { BLANK_SHAPES, halftoneMethodSchema, toneSchema } from './catalog.ts';

/**
 * What a buyer sends to order: for each item, the blank and size, the photo and where it sits,
 * an optional inscription and the confirmations; the buyer and the delivery. Never a price:
 * the server prices every order from the catalog and the studio's rates.
 */
const text = (max: number) => z.string().trim().max(max, `Use at most ${max} characters.`);

/**
 * Where the photo sits: a window of the engraving area's proportions over the upright original,
 * in its pixels (it may reach past the photo's edges, which stay empty); the photo is mirrored if
 * asked and turned by `rotation` degrees clockwise about the window's centre.
 */
export const placementSchema = z.object({
  crop: z.object({
    left: z.number(),
    top: z.number(),
    width: z.number().positive(),
    height: z.number().positive(),
  }),
  rotation: z.number().min(-180).max(180).default(0),
  flipHorizontal: z.boolean().default(false),
});
export type Placement = z.infer<typeof placementSchema>;

export const INSCRIPTION_FONTS = { rounded: 'Nunito', 'rounded-bold': 'Nunito bold' } as const;
export const inscriptionSchema = z.object({
  lines: z.array(text(40).min(1, 'Write the line, or remove it.')).min(1).max(2, 'At most two lines.'),
  font: z.enum(Object.keys(INSCRIPTION_FONTS) as [keyof typeof INSCRIPTION_FONTS, ...(keyof typeof INSCRIPTION_FONTS)[]]),
  /** Letter height as a share of the engraving area's height. */
  size: z.number().min(0.04).max(0.2),
});
export type Inscription = z.infer<typeof inscriptionSchema>;

export const cartItemSchema = z.object({
  blankId: z.uuid(),
  sizeId: z.uuid(),
  orientation: z.enum(['portrait', 'landscape']),
  quantity: z.number().int().min(1, 'At least one.').max(20, 'At most 20 of one item.'),
  photoId: z.uuid('Upload a photo first.'),
  placement: placementSchema,
  inscription: inscriptionSchema.nullable().default(null),
  rightsConfirmed: z.literal(true, { error: 'Confirm that you may use this photo.' }),
  lowResolutionConfirmed: z.boolean().default(false),
});
export type CartItem = z.input<typeof cartItemSchema>;

export const addressSchema = z.object({
  line1: text(120).min(1, 'Enter the street and number.'),
  line2: text(120).default(''),
  city: text(80).min(1, 'Enter the town or city.'),
  region: text(80).default(''),
  postalCode: text(20).min(1, 'Enter the postcode.'),
  country: z
    .string()
    .trim()
    .toUpperCase()
    .regex(/^[A-Z]{2}$/, 'Use the two-letter country code, such as US or GB.'),
});
export type Address = z.infer<typeof addressSchema>;

export const checkoutInputSchema = z.object({
  items: z.array(cartItemSchema).min(1, 'The cart is empty.').max(20, 'At most 20 items in one order.'),
  buyer: z.object({
    email: z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address.')),
    name: text(120).min(1, 'Enter your name.'),
  }),
  delivery: z.discriminatedUnion('method', [
    z.object({ method: z.literal('ship'), rateId: z.uuid('Choose a shipping method.'), address: addressSchema }),
    z.object({ method: z.literal('pickup') }),
  ]),
});
export type CheckoutInput = z.input<typeof checkoutInputSchema>;

export const checkoutAnswerSchema = z.object({ orderId: z.uuid(), paymentUrl: z.string() });

/** What the mock-up needs to draw an item again: recipe, colours, shape and size. */
export const burnLookSchema = z.object({
  shape: z.enum(BLANK_SHAPES),
  surfaceColour: z.string(),
  markColour: z.string(),
  tone: toneSchema,
  halftoneMethod: halftoneMethodSchema,
  linesPerInch: z.number(),
  areaWidthMm: z.number(),
  areaHeightMm: z.number(),
});
export type BurnLook = z.infer<typeof burnLookSchema>;

/** How an item left the studio: by carrier with a tracking number, or collected. */
export const handoverSchema = z.object({
  method: z.enum(['ship', 'pickup']),
  carrier: z.string().nullable(),
  trackingNumber: z.string().nullable(),
  at: z.string(),
  by: z.string(),
});
export type Handover = z.infer<typeof handoverSchema>;

export const orderViewSchema = z.object({
  id: z.uuid(),
  number: z.number().int(),
  status: z.enum(ORDER_STATUSES),
  createdAt: z.string(),
  paidAt: z.string().nullable(),
  currency: z.string(),
  subtotal: z.string(),
  shipping: z.string(),
  total: z.string(),
  /** Paid back so far, or null when nothing was. */
  refunded: z.string().nullable(),
  buyer: z.object({ name: z.string(), email: z.string() }),
  delivery: z.object({ method: z.enum(['ship', 'pickup']), label: z.string(), address: addressSchema.nullable() }),
  note: z.string().nullable(),
  items: z.array(
    z.object({
      id: z.uuid(),
      stage: z.enum(ITEM_STAGES),
      blankName: z.string(),
      sizeLabel: z.string(),
      materialName: z.string(),
      quantity: z.number().int(),
      unitPrice: z.string(),
      photo: z.object({
        id: z.uuid(),
        previewUrl: z.string(),
        previewWidth: z.number(),
        previewHeight: z.number(),
        width: z.number(),
        height: z.number(),
      }),
      placement: placementSchema,
      orientation: z.enum(['portrait', 'landscape']),
      inscription: inscriptionSchema.nullable(),
      look: burnLookSchema,
      handover: handoverSchema.nullable(),
    }),
  ),
  events: z.array(z.object({ at: z.string(), text: z.string() })),
});
export type OrderView = z.infer<typeof orderViewSchema>;

export const myOrdersSchema = z.object({
  /** False until the address is confirmed: orders are matched by it. */
  confirmed: z.boolean(),
  orders: z.array(
    z.object({
      id: z.uuid(),
      number: z.number().int(),
      status: z.enum(ORDER_STATUSES),
      createdAt: z.string(),
      total: z.string(),
      studio: z.object({ slug: z.string(), name: z.string() }),
      items: z.array(z.string()),
    }),
  ),
});
export type MyOrders = z.infer<typeof myOrdersSchema>;
