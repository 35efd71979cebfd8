import type { Bitmap, GrayF } from '../image.ts';

/**
 * Ordered dither with Bayer's matrices: B. E. Bayer, "An optimum method for two-level rendition
 * of continuous-tone pictures", IEEE ICC 1973. Recursion M1 = [0], M2n = [[4M, 4M+2], [4M+3, 4M+1]]
 * (row = y, column = x). A pixel is white when v > 255·(M + 0.5)/n², so a flat grey v gives an
 * exact share of white dots.
 */
export function bayerMatrix(size: 2 | 4 | 8 | 16): number[][] {
  let m = [[0]];
  while (m.length < size) {
    const n = m.length;
    const next = Array.from({ length: 2 * n }, () => new Array<number>(2 * n).fill(0));
    for (let y = 0; y < n; y++) {
      for (let x = 0; x < n; x++) {
        const v = 4 * m[y]![x]!;
        next[y]![x] = v;
        next[y]![x + n] = v + 2;
        next[y + n]![x] = v + 3;
        next[y + n]![x + n] = v + 1;
      }
    }
    m = next;
  }
  return m;
}

export function orderedDither(image: GrayF, size: 2 | 4 | 8 | 16, mask?: Uint8Array): Bitmap {
  const { width, height, data } = image;
  const m = bayerMatrix(size);
  const cells = size * size;
  const thresholds = m.map((row) => row.map((v) => (255 * (v + 0.5)) / cells));
  const out = new Uint8Array(width * height);
  for (let y = 0; y < height; y++) {
    const row = thresholds[y % size]!;
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      out[i] = (mask && mask[i] === 0) || data[i]! > row[x % size]! ? 1 : 0;
    }
  }
  return { width, height, data: out };
}

/** Plain threshold: white above the level. */
export function thresholdDither(image: GrayF, level = 127.5, mask?: Uint8Array): Bitmap {
  const out = new Uint8Array(image.data.length);
  for (let i = 0; i < out.length; i++) out[i] = (mask && mask[i] === 0) || image.data[i]! > level ? 1 : 0;
  return { width: image.width, height: image.height, data: out };
}
