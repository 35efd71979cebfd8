import { availableParallelism } from 'node:os';
import sharp from 'sharp';
import type { Rgba8 } from '../../shared/imaging/image.ts';
import { outputSize } from '../../shared/imaging/sizing.ts';
import { MAX_INPUT_PIXELS } from './photo-decode.ts';

/**
 * Where the photo sits in the engraving area: a crop of the upright photo (source pixels), then a
 * rotation (degrees, clockwise; the corners it opens are transparent, so they do not burn) and
 * optional flips; the result fills the area at the line density, resampled with Lanczos-3.
 */
// libvips picks one thread on a two-core machine; rendering wants them all.
sharp.concurrency(availableParallelism());

export type Placement = {
  crop: { left: number; top: number; width: number; height: number };
  rotation?: number;
  flipHorizontal?: boolean;
  flipVertical?: boolean;
};

export async function placePhoto(bytes: Buffer, placement: Placement, area: { widthMm: number; heightMm: number }, linesPerInch: number): Promise<Rgba8> {
  const size = outputSize(area, linesPerInch);
  const { crop } = placement;
  // Stage 1: upright, cropped (sharp applies one geometry step per pipeline, so crop first).
  const cropped = await sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS })
    .rotate()
    .toColourspace('srgb')
    .ensureAlpha()
    .extract({ left: Math.round(crop.left), top: Math.round(crop.top), width: Math.round(crop.width), height: Math.round(crop.height) })
    .png({ compressionLevel: 0 })
    .toBuffer();
  let pipeline = sharp(cropped);
  if (placement.rotation) pipeline = pipeline.rotate(placement.rotation, { background: { r: 255, g: 255, b: 255, alpha: 0 } });
  if (placement.flipVertical) pipeline = pipeline.flip();
  if (placement.flipHorizontal) pipeline = pipeline.flop();
  const rotated = placement.rotation ? await pipeline.png({ compressionLevel: 0 }).toBuffer() : null;
  const { data, info } = await (rotated ? sharp(rotated) : pipeline)
    .resize({ width: size.width, height: size.height, fit: 'cover', kernel: 'lanczos3' })
    .ensureAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return { width: info.width, height: info.height, data: new Uint8Array(data.buffer, data.byteOffset, data.length) };
}
