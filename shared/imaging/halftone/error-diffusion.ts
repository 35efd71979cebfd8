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
 * Error diffusion to one bit. Every published kernel here fits in three rows and five columns
 * (x − 2 … x + 2), so one general loop serves any of them (`errorDiffuseAnyKernel`): the current
 * row's errors ride in two local carries, the next two rows' in two buffers of width + 4 floats.
 * Floyd–Steinberg and Jarvis–Judice–Ninke, the two studios use most, have loops of their own.
 * Memory beyond input and output is O(width) whatever the image height.
 */
export function errorDiffuse(image: GrayF, options: ErrorDiffusionOptions): Bitmap {
  if (options.kernel === 'floyd-steinberg') return floydSteinberg(image, options);
  if (options.kernel === 'jarvis-judice-ninke') return jarvisJudiceNinke(image, options);
  return errorDiffuseAnyKernel(image, options);
}

/** The general loop, for any kernel of up to three rows and five columns. */
export function errorDiffuseAnyKernel(image: GrayF, options: ErrorDiffusionOptions): Bitmap {
  const { width, height, data } = image;
  const kernel = DIFFUSION_KERNELS[options.kernel];
  const threshold = options.threshold ?? 127.5;
  const serpentine = options.scan === 'serpentine';
  const mask = options.mask;
  // Weights as a 3 × 5 grid: w[dy][dx + 2], divided once here.
  const w = [new Float64Array(5), new Float64Array(5), new Float64Array(5)];
  for (const [dx, dy, weight] of kernel.weights) w[dy]![dx + 2] = weight / kernel.divisor;
  const [, , , r1, r2] = w[0]!;
  const [a0, a1, a2, a3, a4] = w[1]!;
  const [b0, b1, b2, b3, b4] = w[2]!;
  const pad = 2;
  let next1 = new Float64Array(width + 2 * pad); // errors for row y + 1
  let next2 = new Float64Array(width + 2 * pad); // errors for row y + 2
  let current = new Float64Array(width + 2 * pad);
  const out = new Uint8Array(width * height);
  const allInside = new Uint8Array(width).fill(1);

  for (let y = 0; y < height; y++) {
    // Rotate the buffers: what was "next" becomes "current"; the oldest becomes row y + 2, whose
    // every cell is written (not added to) below, so it needs no clearing.
    const recycled = current;
    current = next1;
    next1 = next2;
    next2 = recycled;
    const row = y * width;
    // One mask row at a time (all ones when nothing is cut out): the test in the loop is then a
    // plain array read, the same whether or not there is a mask.
    const inside = mask ? mask.subarray(row, row + width) : allInside;
    const rightward = !serpentine || (y & 1) === 0;
    const step = rightward ? 1 : -1;
    let c1 = 0; // error for the next pixel along the scan
    let c2 = 0; // … and the one after it
    // Sliding windows over the next two rows: partial sums for the positions 2 and 1 behind,
    // at, and 1 ahead of the pixel, kept in locals; each position is written once, when final.
    let u2 = 0,
      u1 = 0,
      u0 = 0,
      uA = 0;
    let v2 = 0,
      v1 = 0,
      v0 = 0,
      vA = 0;
    let x = rightward ? 0 : width - 1;
    for (let n = 0; n < width; n++, x += step) {
      const i = row + x;
      let e = 0;
      if (inside[x] !== 0) {
        const value = data[i]! + current[x + pad]! + c1;
        const white = value > threshold ? 1 : 0;
        out[i] = white;
        e = value - 255 * white;
      } else {
        out[i] = 1;
      }
      c1 = c2 + e * r1!;
      c2 = e * r2!;
      // Along the scan, "behind" is −step: position x − 2·step gets its last share now.
      const behind2 = x - 2 * step + pad;
      next1[behind2]! += u2 + e * a0!;
      next2[behind2] = v2 + e * b0!;
      u2 = u1 + e * a1!;
      u1 = u0 + e * a2!;
      u0 = uA + e * a3!;
      uA = e * a4!;
      v2 = v1 + e * b1!;
      v1 = v0 + e * b2!;
      v0 = vA + e * b3!;
      vA = e * b4!;
    }
    // The last two positions of the row (the rest falls into the padding).
    const last = x - step; // the final pixel processed
    next1[last - step + pad]! += u2;
    next1[last + pad]! += u1;
    next2[last - step + pad] = v2;
    next2[last + pad] = v1;
  }
  return { width, height, data: out };
}

/**
 * Jarvis–Judice–Ninke on its own (the usual method for glass and stone): its twelve weights are
 * four values (1, 3, 5, 7 / 48), so each error needs four products instead of twelve and fewer
 * locals compete for registers. The sums are made in the general loop's order, so the result is
 * the same bit for bit (the unit tests compare them); it runs about twice as fast.
 */
function jarvisJudiceNinke(image: GrayF, options: ErrorDiffusionOptions): Bitmap {
  const { width, height, data } = image;
  const threshold = options.threshold ?? 127.5;
  const serpentine = options.scan === 'serpentine';
  const mask = options.mask;
  const [k1, k3, k5, k7] = [1 / 48, 3 / 48, 5 / 48, 7 / 48];
  const pad = 2;
  let next1 = new Float64Array(width + 2 * pad);
  let next2 = new Float64Array(width + 2 * pad);
  let current = new Float64Array(width + 2 * pad);
  const out = new Uint8Array(width * height);
  const allInside = new Uint8Array(width).fill(1);
  for (let y = 0; y < height; y++) {
    const recycled = current;
    current = next1;
    next1 = next2;
    next2 = recycled;
    const row = y * width;
    const inside = mask ? mask.subarray(row, row + width) : allInside;
    const rightward = !serpentine || (y & 1) === 0;
    const step = rightward ? 1 : -1;
    let c1 = 0,
      c2 = 0;
    let u2 = 0,
      u1 = 0,
      u0 = 0,
      uA = 0;
    let v2 = 0,
      v1 = 0,
      v0 = 0,
      vA = 0;
    let x = rightward ? 0 : width - 1;
    let behind2 = x - 2 * step + pad;
    for (let n = 0; n < width; n++) {
      const i = row + x;
      let e = 0;
      if (inside[x] !== 0) {
        const value = data[i]! + current[x + pad]! + c1;
        const white = value > threshold ? 1 : 0;
        out[i] = white;
        e = value - 255 * white;
      } else {
        out[i] = 1;
      }
      const e1 = e * k1,
        e3 = e * k3,
        e5 = e * k5,
        e7 = e * k7;
      c1 = c2 + e7;
      c2 = e5;
      next1[behind2]! += u2 + e3;
      next2[behind2] = v2 + e1;
      u2 = u1 + e5;
      u1 = u0 + e7;
      u0 = uA + e5;
      uA = e3;
      v2 = v1 + e3;
      v1 = v0 + e5;
      v0 = vA + e3;
      vA = e1;
      x += step;
      behind2 += step;
    }
    const last = x - step;
    next1[last - step + pad]! += u2;
    next1[last + pad]! += u1;
    next2[last - step + pad] = v2;
    next2[last + pad] = v1;
  }
  return { width, height, data: out };
}

/**
 * Floyd–Steinberg on its own: the most used kernel has one next row and four weights, so its
 * loop keeps everything in locals and writes each error cell once.
 */
function floydSteinberg(image: GrayF, options: ErrorDiffusionOptions): Bitmap {
  const { width, height, data } = image;
  const threshold = options.threshold ?? 127.5;
  const serpentine = options.scan === 'serpentine';
  const mask = options.mask;
  const out = new Uint8Array(width * height);
  let current = new Float64Array(width + 2);
  let next = new Float64Array(width + 2);
  const allInside = new Uint8Array(width).fill(1);
  for (let y = 0; y < height; y++) {
    const swap = current;
    current = next;
    next = swap;
    const row = y * width;
    const inside = mask ? mask.subarray(row, row + width) : allInside;
    const step = !serpentine || (y & 1) === 0 ? 1 : -1;
    let x = step === 1 ? 0 : width - 1;
    let carry = 0; // 7/16 of the previous pixel's error
    let behind = 0; // partial sum for the next row one pixel back along the scan
    let here = 0; // … and under the current pixel
    for (let n = 0; n < width; n++, x += step) {
      const i = row + x;
      let e = 0;
      if (inside[x] !== 0) {
        const value = data[i]! + current[x + 1]! + carry;
        const white = value > threshold ? 1 : 0;
        out[i] = white;
        e = value - 255 * white;
      } else {
        out[i] = 1;
      }
      carry = e * 0.4375; // 7/16
      next[x - step + 1] = behind + e * 0.1875; // 3/16, now final
      behind = here + e * 0.3125; // 5/16
      here = e * 0.0625; // 1/16
    }
    next[x - step + 1] = behind; // the last pixel's cell
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
