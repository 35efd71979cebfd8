import { availableParallelism } from 'node:os';
import sharp, { type Sharp } from 'sharp';
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

/** Runs a pipeline to raw pixels and opens them as the next stage's input. */
async function rawStage(pipeline: Sharp): Promise<Sharp> {
  const { data, info } = await pipeline.raw().toBuffer({ resolveWithObject: true });
  return sharp(data, { raw: { width: info.width, height: info.height, channels: info.channels }, limitInputPixels: false });
}

export async function placePhoto(bytes: Buffer, placement: Placement, area: { widthMm: number; heightMm: number }, linesPerInch: number): Promise<Rgba8> {
  const size = outputSize(area, linesPerInch);
  const { crop } = placement;
  // Stage 1: upright, cropped (sharp applies one geometry step per pipeline, so crop first).
  // Stages hand over raw pixels: encoding them in between would be work for nothing.
  const cropped = await rawStage(
    sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS })
      .rotate()
      .toColourspace('srgb')
      .ensureAlpha()
      .extract({ left: Math.round(crop.left), top: Math.round(crop.top), width: Math.round(crop.width), height: Math.round(crop.height) }),
  );
  let pipeline = cropped;
  if (placement.rotation) pipeline = pipeline.rotate(placement.rotation, { background: { r: 255, g: 255, b: 255, alpha: 0 } });
  if (placement.flipVertical) pipeline = pipeline.flip();
  if (placement.flipHorizontal) pipeline = pipeline.flop();
  if (placement.rotation) pipeline = await rawStage(pipeline);
  const { data, info } = await pipeline
    .resize({ width: size.width, height: size.height, fit: 'cover', kernel: 'lanczos3' })
    .ensureAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return { width: info.width, height: info.height, data: new Uint8Array(data.buffer, data.byteOffset, data.length) };
}
