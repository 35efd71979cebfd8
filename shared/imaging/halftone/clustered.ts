import type { Bitmap, GrayF } from '../image.ts';

/**
 * A clustered-dot screen: dots that grow from the centre of each cell of a grid rotated by
 * `angleDegrees`, with `cellsPerInch` cells per inch at `pixelsPerInch` (T. M. Holladay, Proc. SID
 * 21(2), 1980; spot functions as in the PostScript Language Reference, 3rd ed., §7.4). The spot
 * function is the round dot (1 − (x² + y²)/2 on cell coordinates in −1…1). Its values are turned
 * into ranks (the share of the cell with a lower value), so that a flat grey covers its share of
 * the cell; a pixel is black where its rank is above the lightness, and dark tones grow big dots.
 */
const spotFunction = (cu: number, cv: number) => 1 - (cu * cu + cv * cv) / 2;

/** Sorted spot values over a fine grid of one cell: the ranks' lookup table. */
const SAMPLES = (() => {
  const n = 64;
  const values = new Float64Array(n * n);
  for (let j = 0; j < n; j++)
    for (let i = 0; i < n; i++) values[j * n + i] = spotFunction((2 * (i + 0.5)) / n - 1, (2 * (j + 0.5)) / n - 1);
  return values.sort();
})();

function rankOf(spot: number): number {
  let lo = 0;
  let hi = SAMPLES.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (SAMPLES[mid]! < spot) lo = mid + 1;
    else hi = mid;
  }
  return lo / SAMPLES.length;
}
export type ClusteredOptions = { cellsPerInch: number; pixelsPerInch: number; angleDegrees?: number; mask?: Uint8Array };

export function clusteredDot(image: GrayF, options: ClusteredOptions): Bitmap {
  const { width, height, data } = image;
  const cell = options.pixelsPerInch / options.cellsPerInch; // cell size in pixels
  if (!(cell >= 2)) throw new RangeError('a screen cell must span at least 2 pixels');
  const angle = ((options.angleDegrees ?? 45) * Math.PI) / 180;
  const cos = Math.cos(angle);
  const sin = Math.sin(angle);
  const out = new Uint8Array(width * height);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      if (options.mask && options.mask[i] === 0) {
        out[i] = 1;
        continue;
      }
      // Pixel centre in rotated cell coordinates, then its position inside the cell (−1…1).
      const u = ((x + 0.5) * cos + (y + 0.5) * sin) / cell;
      const v = (-(x + 0.5) * sin + (y + 0.5) * cos) / cell;
      const cu = 2 * (u - Math.floor(u)) - 1;
      const cv = 2 * (v - Math.floor(v)) - 1;
      out[i] = rankOf(spotFunction(cu, cv)) >= data[i]! / 255 ? 0 : 1;
    }
  }
  return { width, height, data: out };
}
