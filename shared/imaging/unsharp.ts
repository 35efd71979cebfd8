import type { GrayF } from './image.ts';
import { gaussianBlur } from './blur.ts';

/**
 * Unsharp mask: g = f + k·(f − blur_σ(f)), left unchanged where |f − blur| is under the threshold
 * (R. C. Gonzalez, R. E. Woods, Digital Image Processing, 3rd ed., §3.6.3). Engraving wants it
 * strong: the burn spreads each dot and softens detail.
 */
export type UnsharpOptions = {
  /** Percent: 0–500 (k = amount / 100). */
  amount: number;
  /** Gaussian σ in pixels at output resolution. */
  radius: number;
  /** In code values 0–255. */
  threshold: number;
};

/** The formula on its own, given the blurred image: results are clamped to 0–255. Writes into `into` (a new image by default). */
export function applyUnsharp(
  original: GrayF,
  blurred: GrayF,
  amount: number,
  threshold: number,
  into: Float32Array = new Float32Array(original.data.length),
): GrayF {
  const k = amount / 100;
  const out = into;
  for (let i = 0; i < out.length; i++) {
    const f = original.data[i]!;
    const diff = f - blurred.data[i]!;
    const g = Math.abs(diff) >= threshold ? f + k * diff : f;
    out[i] = g < 0 ? 0 : g > 255 ? 255 : g;
  }
  return { width: original.width, height: original.height, data: out };
}

/** Sharpens; `inPlace` writes the result over the input (the pipeline's way, to spare memory). */
export function unsharpMask(image: GrayF, options: UnsharpOptions, { inPlace = false } = {}): GrayF {
  if (options.amount < 0 || options.amount > 500) throw new RangeError('amount must be 0–500 %');
  const blurred = gaussianBlur(image, options.radius);
  return applyUnsharp(image, blurred, options.amount, options.threshold, inPlace ? image.data : blurred.data);
}
