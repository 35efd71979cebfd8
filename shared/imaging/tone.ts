import type { GrayF } from './image.ts';

/**
 * Tone adjustments (in place, like every step after grayscale) as one lookup per pixel: brightness (−100…100, added in code values × 1.275),
 * contrast (−100…100, a slope about mid-grey 127.5), gamma (> 0; output = 255·(v/255)^(1/γ), so
 * γ > 1 lightens mid-tones), then an optional tone curve for the material's mark response.
 */
export type ToneOptions = {
  brightness?: number;
  contrast?: number;
  gamma?: number;
  /** Points (input, output) in 0–255, joined by straight lines; ends are held flat. */
  curve?: Array<[number, number]>;
};

export function toneValue(v: number, { brightness = 0, contrast = 0, gamma = 1, curve }: ToneOptions): number {
  let x = v + brightness * 1.275;
  const slope = Math.tan(((contrast + 100) / 200) * (Math.PI / 2));
  x = (x - 127.5) * slope + 127.5;
  x = x < 0 ? 0 : x > 255 ? 255 : x;
  x = 255 * (x / 255) ** (1 / gamma);
  return curve && curve.length ? applyCurve(x, curve) : x;
}

function applyCurve(x: number, curve: Array<[number, number]>): number {
  const points = [...curve].sort((a, b) => a[0] - b[0]);
  if (x <= points[0]![0]) return points[0]![1];
  for (let i = 1; i < points.length; i++) {
    const [x1, y1] = points[i]!;
    const [x0, y0] = points[i - 1]!;
    if (x <= x1) return y0 + ((y1 - y0) * (x - x0)) / (x1 - x0 || 1);
  }
  return points[points.length - 1]![1];
}

/** Adjusts in place through a 4096-step lookup table (values are code values 0–255). */
export function adjustTone(image: GrayF, options: ToneOptions): GrayF {
  const steps = 4096;
  const table = new Float32Array(steps + 1);
  for (let s = 0; s <= steps; s++) table[s] = toneValue((s * 255) / steps, options);
  const data = image.data;
  for (let i = 0; i < data.length; i++) {
    const v = data[i]!;
    const at = ((v < 0 ? 0 : v > 255 ? 255 : v) * steps) / 255;
    const k = Math.floor(at);
    const f = at - k;
    data[i] = k >= steps ? table[steps]! : table[k]! * (1 - f) + table[k + 1]! * f;
  }
  return image;
}

/**
 * Auto-levels: stretches the values so that `clip` of the pixels (e.g. 0.005 = 0.5 %) at each end
 * become pure black and white. Pixels where `mask` is 0 are not counted.
 */
export type Levels = { low: number; high: number };

/** The black and white points that clip `clip` of the counted pixels at each end; undefined when flat. */
export function levelsFor(image: GrayF, clip = 0.005, mask?: Uint8Array): Levels | undefined {
  const histogram = new Float64Array(256);
  let counted = 0;
  for (let i = 0; i < image.data.length; i++) {
    if (mask && mask[i] === 0) continue;
    const v = Math.round(image.data[i]!);
    histogram[v < 0 ? 0 : v > 255 ? 255 : v]!++;
    counted++;
  }
  if (!counted) return undefined;
  const cut = counted * clip;
  let low = 0;
  for (let seen = 0; low < 255 && seen + histogram[low]! <= cut; low++) seen += histogram[low]!;
  let high = 255;
  for (let seen = 0; high > 0 && seen + histogram[high]! <= cut; high--) seen += histogram[high]!;
  return high > low ? { low, high } : undefined;
}

/** Stretches low…high to 0…255, in place. */
export function applyLevels(image: GrayF, { low, high }: Levels): GrayF {
  const out = image.data;
  for (let i = 0; i < out.length; i++) {
    const v = ((image.data[i]! - low) * 255) / (high - low);
    out[i] = v < 0 ? 0 : v > 255 ? 255 : v;
  }
  return image;
}

/** Negative, in place, for materials where the mark is lighter than the surface. */
export function invert(image: GrayF): GrayF {
  const data = image.data;
  for (let i = 0; i < data.length; i++) data[i] = 255 - data[i]!;
  return image;
}
