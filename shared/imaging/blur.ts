import type { GrayF } from './image.ts';

/** A normalised 1-D Gaussian of standard deviation sigma, truncated at 3σ. */
export function gaussianKernel(sigma: number): Float32Array {
  const radius = Math.max(1, Math.ceil(3 * sigma));
  const kernel = new Float32Array(2 * radius + 1);
  let sum = 0;
  for (let i = -radius; i <= radius; i++) {
    const w = Math.exp(-(i * i) / (2 * sigma * sigma));
    kernel[i + radius] = w;
    sum += w;
  }
  for (let i = 0; i < kernel.length; i++) kernel[i]! /= sum;
  return kernel;
}

/**
 * Separable Gaussian blur; edges repeat their last pixel. sigma ≤ 0 returns a copy. The
 * horizontal pass works on a padded copy of each row and the vertical pass adds whole rows, so
 * neither inner loop has a bounds test.
 */
export function gaussianBlur(image: GrayF, sigma: number): GrayF {
  const { width, height, data } = image;
  if (sigma <= 0) return { width, height, data: data.slice() };
  if (sigma >= 1.5) return boxBlurApproximation(image, sigma);
  const kernel = gaussianKernel(sigma);
  const taps = kernel.length;
  const radius = (taps - 1) / 2;
  const temp = new Float32Array(data.length);
  const padded = new Float32Array(width + 2 * radius);
  for (let y = 0; y < height; y++) {
    const row = y * width;
    padded.set(data.subarray(row, row + width), radius);
    padded.fill(data[row]!, 0, radius);
    padded.fill(data[row + width - 1]!, radius + width);
    for (let x = 0; x < width; x++) {
      let acc = 0;
      for (let k = 0; k < taps; k++) acc += padded[x + k]! * kernel[k]!;
      temp[row + x] = acc;
    }
  }
  const out = new Float32Array(data.length);
  for (let y = 0; y < height; y++) {
    const target = y * width;
    for (let k = 0; k < taps; k++) {
      const sy = Math.min(height - 1, Math.max(0, y + k - radius));
      const source = sy * width;
      const w = kernel[k]!;
      for (let x = 0; x < width; x++) out[target + x]! += temp[source + x]! * w;
    }
  }
  return { width, height, data: out };
}

/**
 * Box widths for three passes whose combined variance matches σ² (P. Kovesi, "Fast almost-
 * Gaussian filtering", DICTA 2010; the same idea as Pillow's GaussianBlur). Odd widths wl and wl + 2.
 */
export function boxWidthsFor(sigma: number, passes = 3): number[] {
  const ideal = Math.sqrt((12 * sigma * sigma) / passes + 1);
  let wl = Math.floor(ideal);
  if (wl % 2 === 0) wl--;
  const wu = wl + 2;
  const m = Math.round((12 * sigma * sigma - passes * wl * wl - 4 * passes * wl - 3 * passes) / (-4 * wl - 4));
  return Array.from({ length: passes }, (_, i) => (i < m ? wl : wu));
}

/** Three running-sum box passes each way: the cost per pixel does not grow with σ. */
function boxBlurApproximation(image: GrayF, sigma: number): GrayF {
  const { width, height } = image;
  const a = image.data.slice();
  const b = new Float32Array(a.length);
  for (const size of boxWidthsFor(sigma)) {
    const r = (size - 1) / 2;
    boxHorizontal(a, b, width, height, r);
    boxVertical(b, a, width, height, r);
  }
  return { width, height, data: a };
}

function boxHorizontal(src: Float32Array, dst: Float32Array, width: number, height: number, r: number): void {
  const scale = 1 / (2 * r + 1);
  for (let y = 0; y < height; y++) {
    const row = y * width;
    const first = src[row]!;
    const last = src[row + width - 1]!;
    let acc = first * (r + 1);
    for (let k = 1; k <= r; k++) acc += src[row + Math.min(k, width - 1)]!;
    for (let x = 0; x < width; x++) {
      dst[row + x] = acc * scale;
      const add = x + r + 1 < width ? src[row + x + r + 1]! : last;
      const remove = x - r >= 0 ? src[row + x - r]! : first;
      acc += add - remove;
    }
  }
}

function boxVertical(src: Float32Array, dst: Float32Array, width: number, height: number, r: number): void {
  const scale = 1 / (2 * r + 1);
  const acc = new Float64Array(width);
  const lastRow = (height - 1) * width;
  for (let x = 0; x < width; x++) {
    let sum = src[x]! * (r + 1);
    for (let k = 1; k <= r; k++) sum += src[Math.min(k, height - 1) * width + x]!;
    acc[x] = sum;
  }
  for (let y = 0; y < height; y++) {
    const row = y * width;
    const addRow = y + r + 1 < height ? (y + r + 1) * width : lastRow;
    const removeRow = y - r >= 0 ? (y - r) * width : 0;
    for (let x = 0; x < width; x++) {
      dst[row + x] = acc[x]! * scale;
      acc[x]! += src[addRow + x]! - src[removeRow + x]!;
    }
  }
}
