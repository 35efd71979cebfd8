import sharp from 'sharp';
import { inspectPhoto, MAX_INPUT_PIXELS } from './photo-decode.ts';

/** Longest side of a product photo as shown on the storefront: sharp on large, high-density screens. */
export const WEB_PHOTO_SIDE = 1600;
/** Below this a product photo looks blurred even as a thumbnail. */
export const MIN_PRODUCT_PHOTO_SIDE = 300;

/** A studio's logo: small, transparency kept. */
export const LOGO_OPTIONS = { side: 512, minSide: 64, what: 'Logos' };

/**
 * A product photo (or a logo) made ready for the web: checked like any photo, turned upright, scaled to fit
 * WEB_PHOTO_SIDE (never enlarged), converted to sRGB WebP without its metadata (no GPS in EXIF).
 */
export async function toWebPhoto(
  bytes: Buffer,
  { side = WEB_PHOTO_SIDE, minSide = MIN_PRODUCT_PHOTO_SIDE, what = 'Product photos' } = {},
): Promise<{ data: Buffer; width: number; height: number }> {
  await inspectPhoto(bytes, {
    minSide,
    tooSmall: (w, h) => `This image is only ${w} × ${h} pixels. ${what} need at least ${minSide} pixels on the short side.`,
  });
  const { data, info } = await sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS })
    .rotate()
    .resize({ width: side, height: side, fit: 'inside', withoutEnlargement: true })
    .toColourspace('srgb')
    .webp({ quality: 82 })
    .toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height };
}
