import { MM_PER_INCH } from './sizing.ts';

/**
 * Whether a photo has enough pixels for the size it will be engraved at. Print practice wants
 * about 300 pixels per inch at the final size and treats under about 150 as too low (common
 * practice, no single source).
 */
export const GOOD_PPI = 300;
export const FAIR_PPI = 150;

export type Verdict = 'good' | 'fair' | 'too-low';

/**
 * Effective pixels per inch of a crop shown at a physical size: the smaller of the two axes
 * (the crop is scaled uniformly, so the weaker axis limits detail).
 */
export function effectivePpi(crop: { width: number; height: number }, area: { widthMm: number; heightMm: number }): number {
  return Math.min(crop.width / (area.widthMm / MM_PER_INCH), crop.height / (area.heightMm / MM_PER_INCH));
}

export function verdictFor(ppi: number): Verdict {
  if (ppi >= GOOD_PPI) return 'good';
  if (ppi >= FAIR_PPI) return 'fair';
  return 'too-low';
}

/** The largest size of the same proportions at which the crop still reaches `FAIR_PPI`, in mm. */
export function largestFairSize(
  crop: { width: number; height: number },
  area: { widthMm: number; heightMm: number },
): { widthMm: number; heightMm: number } {
  const scale = Math.min(1, effectivePpi(crop, area) / FAIR_PPI);
  return { widthMm: area.widthMm * scale, heightMm: area.heightMm * scale };
}

/**
 * Of the sizes offered, the largest whose verdict is at least fair for this crop; undefined when
 * none is. Sizes are compared by area.
 */
export function largestFairOffered<T extends { widthMm: number; heightMm: number }>(
  crop: { width: number; height: number },
  sizes: T[],
): T | undefined {
  return sizes
    .filter((s) => verdictFor(effectivePpi(crop, s)) !== 'too-low')
    .sort((a, b) => b.widthMm * b.heightMm - a.widthMm * a.heightMm)[0];
}

/**
 * Sharpness: the variance of the 4-neighbour Laplacian (J. L. Pech-Pacheco et al., "Diatom
 * autofocusing in brightfield microscopy: a comparative study", ICPR 2000) on the photo scaled so
 * its long side is `LAPLACIAN_SIDE` pixels, which makes the figure comparable between photos of
 * different sizes. Gray input, code values.
 */
export const LAPLACIAN_SIDE = 512;

export function laplacianVariance(image: { width: number; height: number; data: Float32Array | Uint8Array }): number {
  const { width, height, data } = image;
  let sum = 0;
  let sumSq = 0;
  let n = 0;
  for (let y = 1; y < height - 1; y++) {
    for (let x = 1; x < width - 1; x++) {
      const i = y * width + x;
      const l = data[i - 1]! + data[i + 1]! + data[i - width]! + data[i + width]! - 4 * data[i]!;
      sum += l;
      sumSq += l * l;
      n++;
    }
  }
  if (!n) return 0;
  const mean = sum / n;
  return sumSq / n - mean * mean;
}

/** Shares of clipped shadows (≤ 2) and highlights (≥ 253): large shares mean detail is lost. */
export function exposure(image: { data: Float32Array | Uint8Array }): { shadows: number; highlights: number } {
  let shadows = 0;
  let highlights = 0;
  for (const v of image.data) {
    if (v <= 2) shadows++;
    else if (v >= 253) highlights++;
  }
  return { shadows: shadows / image.data.length, highlights: highlights / image.data.length };
}

/**
 * Below this Laplacian variance (at LAPLACIAN_SIDE) a photo looks blurred. Chosen on the
 * scikit-image photographs: sharp originals measure 190–1280 (the cat's soft fur is the lowest),
 * the same photos blurred with a Gaussian of σ = 1.5 px at that scale 8–40 and with σ = 2 px
 * 5–16. Our own choice from those figures, not a published value.
 */
export const BLUR_THRESHOLD = 30;

/** More than this share of clipped shadows or highlights is worth a word to the buyer (our own choice). */
export const CLIPPED_SHARE_WARNING = 0.2;

export type PhotoQuality = { sharpness: number; blurry: boolean; shadows: number; highlights: number; exposure: 'ok' | 'dark' | 'bright' };

/** Sharpness and exposure of a gray image already scaled so its long side is LAPLACIAN_SIDE. */
export function photoQuality(gray: { width: number; height: number; data: Float32Array | Uint8Array }): PhotoQuality {
  const sharpness = laplacianVariance(gray);
  const { shadows, highlights } = exposure(gray);
  return {
    sharpness: Math.round(sharpness),
    blurry: sharpness < BLUR_THRESHOLD,
    shadows,
    highlights,
    exposure: shadows > CLIPPED_SHARE_WARNING ? 'dark' : highlights > CLIPPED_SHARE_WARNING ? 'bright' : 'ok',
  };
}
