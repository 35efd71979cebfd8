import type { Bitmap, GrayF } from '../image.ts';
import { DIFFUSION_KERNELS, type DiffusionKernelId } from './kernels.ts';

export type ErrorDiffusionOptions = {
  kernel: DiffusionKernelId;
  /** Left to right on every row, or alternating direction (less "worming" on flat areas). */
  scan?: 'raster' | 'serpentine';
  /** Values above this become white. */
  threshold?: number;
  /** Pixels where this is 0 are left white and take no part in the diffusion (the cut-out). */
  mask?: Uint8Array;
};

/**
 * Error diffusion to one bit. Memory beyond input and output is a few rows of errors
 * (kernel height × (width + 4) floats), so an 80-megapixel file diffuses in O(width) state.
 */
export function errorDiffuse(image: GrayF, options: ErrorDiffusionOptions): Bitmap {
  const { width, height, data } = image;
  const kernel = DIFFUSION_KERNELS[options.kernel];
  const threshold = options.threshold ?? 127.5;
  const serpentine = options.scan === 'serpentine';
  const mask = options.mask;
  const depth = Math.max(...kernel.weights.map(([, dy]) => dy)) + 1;
  const pad = 2;
  const stride = width + 2 * pad;
  // Row r of the image uses errors[r % depth]; each row's buffer is cleared as it is recycled.
  const errors = Array.from({ length: depth }, () => new Float32Array(stride));
  const taps = kernel.weights.map(([dx, dy, w]) => ({ dx, dy, w: w / kernel.divisor }));
  const out = new Uint8Array(width * height);

  for (let y = 0; y < height; y++) {
    const current = errors[y % depth]!;
    const leftToRight = !serpentine || y % 2 === 0;
    const rowBuffers = taps.map((t) => errors[(y + t.dy) % depth]!);
    for (let step = 0; step < width; step++) {
      const x = leftToRight ? step : width - 1 - step;
      const i = y * width + x;
      if (mask && mask[i] === 0) {
        out[i] = 1;
        current[x + pad] = 0;
        continue;
      }
      const value = data[i]! + current[x + pad]!;
      const white = value > threshold;
      out[i] = white ? 1 : 0;
      const error = value - (white ? 255 : 0);
      for (let k = 0; k < taps.length; k++) {
        const t = taps[k]!;
        const tx = x + (leftToRight ? t.dx : -t.dx);
        if (tx < 0 || tx >= width) continue;
        rowBuffers[k]![tx + pad]! += error * t.w;
      }
    }
    current.fill(0);
  }
  return { width, height, data: out };
}

/**
 * Floyd–Steinberg exactly as Pillow's `Image.convert('1')` does it (libImaging, tobilevel):
 * raster order, integer error terms 7e, 3e, 5e, 1e summed and divided by 16 with truncation toward
 * zero, the value clamped to 0–255 before its error is taken, white when above 128. Used to check
 * this core against Pillow bit for bit; `errorDiffuse` is the production path.
 */
export function floydSteinbergPillow(image: { width: number; height: number; data: Uint8Array }): Bitmap {
  const { width, height, data } = image;
  const out = new Uint8Array(width * height);
  const errors = new Int32Array(width + 1);
  for (let y = 0; y < height; y++) {
    let l = 0;
    let l0 = 0;
    let l1 = 0;
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      const v = data[i]! + Math.trunc((l + errors[x + 1]!) / 16);
      l = v < 0 ? 0 : v > 255 ? 255 : v;
      const white = l > 128;
      out[i] = white ? 1 : 0;
      l -= white ? 255 : 0;
      const l2 = l;
      const d2 = l + l;
      l += d2; // 3e
      errors[x] = l + l0; // 3e here + 5e of the previous pixel + 1e of the one before
      l += d2; // 5e
      l0 = l + l1;
      l1 = l2; // 1e
      l += d2; // 7e, carried to the next pixel
    }
    errors[width] = l0;
  }
  return { width, height, data: out };
}
