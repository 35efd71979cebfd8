import sharp, { type Metadata } from 'sharp';
import { AppError } from '#shared/errors.ts';
import type { Rgba8 } from '#shared/imaging/image.ts';

/**
 * Reading buyers' photos with sharp (libvips): type by magic bytes, a pixel limit against
 * decompression bombs, EXIF orientation applied, colour converted to sRGB, alpha kept. Every
 * failure becomes a plain message a buyer can act on.
 */
export const MAX_INPUT_PIXELS = 100_000_000; // 100 MP: beyond any phone, far below a bomb
export const MIN_SIDE = 64;

export type PhotoFormat = 'jpeg' | 'png' | 'webp' | 'tiff' | 'avif' | 'heic';

/** The format from the first bytes, or undefined for anything we do not take. */
export function sniffFormat(bytes: Uint8Array): PhotoFormat | undefined {
  const b = bytes;
  if (b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return 'jpeg';
  if (b[0] === 0x89 && b[1] === 0x50 && b[2] === 0x4e && b[3] === 0x47) return 'png';
  if (
    b[0] === 0x52 &&
    b[1] === 0x49 &&
    b[2] === 0x46 &&
    b[3] === 0x46 &&
    b[8] === 0x57 &&
    b[9] === 0x45 &&
    b[10] === 0x42 &&
    b[11] === 0x50
  )
    return 'webp';
  if ((b[0] === 0x49 && b[1] === 0x49 && b[2] === 0x2a && b[3] === 0) || (b[0] === 0x4d && b[1] === 0x4d && b[2] === 0 && b[3] === 0x2a))
    return 'tiff';
  // ISO base media file: 'ftyp' at 4, then the major brand (ISO/IEC 14496-12; HEIF brands in 23008-12).
  if (b[4] === 0x66 && b[5] === 0x74 && b[6] === 0x79 && b[7] === 0x70) {
    const brands = new TextDecoder('latin1').decode(b.subarray(8, Math.min(b.length, 64)));
    if (/avif|avis/.test(brands)) return 'avif';
    if (/heic|heix|hevc|hevx|heim|heis|mif1|msf1/.test(brands)) return 'heic';
  }
  return undefined;
}

const UNSUPPORTED = 'This file is not a photo we can use. Please send a JPEG, PNG or WebP photo.';
const HEIC =
  'This photo is in HEIC format, which we cannot read here. Choose "Most Compatible" (JPEG) in your phone’s camera settings, or upload it from our page, which converts it for you.';

export function toPhotoError(error: unknown): AppError {
  const message = (error as Error).message ?? '';
  if (/pixel limit/i.test(message))
    return new AppError(
      'PAYLOAD_TOO_LARGE',
      `This photo has more pixels than we accept (${MAX_INPUT_PIXELS / 1_000_000} megapixels). Please send a smaller version.`,
    );
  if (/unsupported image format/i.test(message)) return new AppError('UNSUPPORTED_MEDIA_TYPE', UNSUPPORTED);
  return new AppError('BAD_REQUEST', 'This photo seems damaged and could not be read. Please try another copy of it.', { cause: error });
}

export type PhotoFacts = { format: PhotoFormat; width: number; height: number; hasAlpha: boolean; orientation: number };

/** Checks a photo without decoding its pixels: type, damage, pixel limit, smallest size. */
export async function inspectPhoto(
  bytes: Buffer,
  {
    minSide = MIN_SIDE,
    tooSmall = (w: number, h: number) => `This image is only ${w} × ${h} pixels: too small to engrave. Please send the original photo.`,
  } = {},
): Promise<PhotoFacts> {
  const format = sniffFormat(bytes);
  if (format === 'heic') throw new AppError('UNSUPPORTED_MEDIA_TYPE', HEIC);
  if (!format) throw new AppError('UNSUPPORTED_MEDIA_TYPE', UNSUPPORTED);
  let meta: Metadata;
  try {
    meta = await sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' }).metadata();
  } catch (error) {
    throw toPhotoError(error);
  }
  const orientation = meta.orientation ?? 1;
  const [width, height] = orientation >= 5 ? [meta.height ?? 0, meta.width ?? 0] : [meta.width ?? 0, meta.height ?? 0];
  if (Math.min(width, height) < minSide) throw new AppError('BAD_REQUEST', tooSmall(width, height));
  return { format, width, height, hasAlpha: Boolean(meta.hasAlpha), orientation };
}

/**
 * Decodes to upright sRGB RGBA, optionally scaled down so its longer side is at most `maxSide`
 * (the screen preview the mock-up works on).
 */
export async function decodePhoto(bytes: Buffer, { maxSide }: { maxSide?: number } = {}): Promise<Rgba8> {
  await inspectPhoto(bytes);
  try {
    let pipeline = sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' }).rotate().toColourspace('srgb').ensureAlpha();
    if (maxSide)
      pipeline = pipeline.resize({ width: maxSide, height: maxSide, fit: 'inside', withoutEnlargement: true, kernel: 'lanczos3' });
    const { data, info } = await pipeline.raw().toBuffer({ resolveWithObject: true });
    return { width: info.width, height: info.height, data: new Uint8Array(data.buffer, data.byteOffset, data.length) };
  } catch (error) {
    throw toPhotoError(error);
  }
}
