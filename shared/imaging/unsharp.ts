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

/** The formula on its own, given the blurred image: results are clamped to 0–255. */
export function applyUnsharp(original: GrayF, blurred: GrayF, amount: number, threshold: number): GrayF {
  const k = amount / 100;
  const out = new Float32Array(original.data.length);
  for (let i = 0; i < out.length; i++) {
    const f = original.data[i]!;
    const diff = f - blurred.data[i]!;
    const g = Math.abs(diff) >= threshold ? f + k * diff : f;
    out[i] = g < 0 ? 0 : g > 255 ? 255 : g;
  }
  return { width: original.width, height: original.height, data: out };
}

export function unsharpMask(image: GrayF, options: UnsharpOptions): GrayF {
  if (options.amount < 0 || options.amount > 500) throw new RangeError('amount must be 0–500 %');
  return applyUnsharp(image, gaussianBlur(image, options.radius), options.amount, options.threshold);
}
