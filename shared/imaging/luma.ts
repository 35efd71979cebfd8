import type { GrayF, Rgba8 } from './image.ts';

/**
 * Grayscale from colour. The default is ITU-R BT.709-6 luma on the encoded (gamma) sRGB values,
 * Y' = 0.2126 R' + 0.7152 G' + 0.0722 B': sRGB shares BT.709's primaries, and working on code
 * values keeps a mid-grey at 50 % dot coverage after halftoning, as print workflows expect.
 * BT.601-7 (0.299, 0.587, 0.114) is what most photo software uses for "grayscale"; the linear
 * option weights linear light (IEC 61966-2-1 decode, BT.709 weights, re-encode), which keeps
 * the perceived lightness of saturated colours closer to the original.
 */
export type LumaMode = 'bt709' | 'bt601' | 'linear709';

export const LUMA_WEIGHTS = {
  bt709: [0.2126, 0.7152, 0.0722],
  bt601: [0.299, 0.587, 0.114],
} as const;

/** sRGB transfer curve, IEC 61966-2-1:1999, on values 0–1. */
export function srgbToLinear(v: number): number {
  return v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4;
}

export function linearToSrgb(l: number): number {
  return l <= 0.0031308 ? 12.92 * l : 1.055 * l ** (1 / 2.4) - 0.055;
}

const DECODE = Float32Array.from({ length: 256 }, (_, i) => srgbToLinear(i / 255));

/**
 * Gray from RGBA. Alpha is not applied here (the cut-out mask carries it); fully transparent
 * pixels keep their colour's gray, so the mask alone decides what burns.
 */
export function rgbaToGray(image: Rgba8, mode: LumaMode = 'bt709'): GrayF {
  const { width, height, data } = image;
  const out = new Float32Array(width * height);
  if (mode === 'linear709') {
    const [wr, wg, wb] = LUMA_WEIGHTS.bt709;
    for (let i = 0, p = 0; i < out.length; i++, p += 4) {
      const y = wr * DECODE[data[p]!]! + wg * DECODE[data[p + 1]!]! + wb * DECODE[data[p + 2]!]!;
      out[i] = 255 * linearToSrgb(y);
    }
  } else {
    const [wr, wg, wb] = LUMA_WEIGHTS[mode];
    for (let i = 0, p = 0; i < out.length; i++, p += 4) out[i] = wr * data[p]! + wg * data[p + 1]! + wb * data[p + 2]!;
  }
  return { width, height, data: out };
}
