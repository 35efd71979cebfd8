import { availableParallelism } from 'node:os';
import pLimit from 'p-limit';
import sharp from 'sharp';
import { LAPLACIAN_SIDE, photoQuality, type PhotoQuality } from '#shared/imaging/photo-checks.ts';
import { inspectPhoto, MAX_INPUT_PIXELS, toPhotoError, type PhotoFacts } from './photo-decode.ts';

/** Long side of the designer's preview: enough for a sharp mock-up on a large screen. */
export const PREVIEW_SIDE = 1600;
export const THUMB_SIDE = 400;

export type PhotoDerivatives = {
  facts: PhotoFacts;
  preview: { data: Buffer; width: number; height: number };
  thumb: Buffer;
  quality: PhotoQuality;
};

/**
 * What the app makes of a buyer's photo once it arrives: the checks of `inspectPhoto` (type by
 * magic bytes, damage, pixel limit, smallest size), an upright sRGB WebP preview and thumbnail
 * (alpha kept, metadata dropped), and the sharpness and exposure checks on a 512 px gray copy.
 */
export function makePhotoDerivatives(bytes: Buffer): Promise<PhotoDerivatives> {
  return oneCorePerPhoto(() => derive(bytes));
}

/**
 * Photos are worked on a few at a time, one per core: a crowd of uploads at once then waits its
 * turn in order instead of every photo's three decodes fighting for the same two cores (with
 * 200 at once, a quarter of the throughput was lost to that, and the memory of 600 decodes).
 */
const oneCorePerPhoto = pLimit(Math.max(2, availableParallelism()));

async function derive(bytes: Buffer): Promise<PhotoDerivatives> {
  const facts = await inspectPhoto(bytes);
  const upright = () => sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' }).rotate().toColourspace('srgb');
  const fit = (side: number) => ({ width: side, height: side, fit: 'inside' as const, withoutEnlargement: true });
  // A file whose header reads well can still be cut short or damaged further in.
  const [preview, thumb, gray] = await Promise.all([
    upright().resize(fit(PREVIEW_SIDE)).webp({ quality: 86 }).toBuffer({ resolveWithObject: true }),
    upright().resize(fit(THUMB_SIDE)).webp({ quality: 80 }).toBuffer(),
    upright().resize(fit(LAPLACIAN_SIDE)).grayscale().extractChannel(0).raw().toBuffer({ resolveWithObject: true }),
  ]).catch((error: unknown) => {
    throw toPhotoError(error);
  });
  return {
    facts,
    preview: { data: preview.data, width: preview.info.width, height: preview.info.height },
    thumb,
    quality: photoQuality({
      width: gray.info.width,
      height: gray.info.height,
      data: new Uint8Array(gray.data.buffer, gray.data.byteOffset, gray.data.length),
    }),
  };
}
