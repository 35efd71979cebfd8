import { z } from 'zod';

/** A buyer's photo as the storefront knows it: its upright size, where to load it, its checks. */
export const buyerPhotoSchema = z.object({
  id: z.uuid(),
  width: z.number().int(),
  height: z.number().int(),
  previewUrl: z.string(),
  previewWidth: z.number().int(),
  previewHeight: z.number().int(),
  thumbUrl: z.string(),
  quality: z.object({
    sharpness: z.number(),
    blurry: z.boolean(),
    shadows: z.number(),
    highlights: z.number(),
    exposure: z.enum(['ok', 'dark', 'bright']),
  }),
});
export type BuyerPhotoView = z.infer<typeof buyerPhotoSchema>;
