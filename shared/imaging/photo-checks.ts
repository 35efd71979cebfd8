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
export function largestFairSize(crop: { width: number; height: number }, area: { widthMm: number; heightMm: number }): { widthMm: number; heightMm: number } {
  const scale = Math.min(1, effectivePpi(crop, area) / FAIR_PPI);
  return { widthMm: area.widthMm * scale, heightMm: area.heightMm * scale };
}

/**
 * Of the sizes offered, the largest whose verdict is at least fair for this crop; undefined when
 * none is. Sizes are compared by area.
 */
export function largestFairOffered<T extends { widthMm: number; heightMm: number }>(crop: { width: number; height: number }, sizes: T[]): T | undefined {
  return sizes
    .filter((s) => verdictFor(effectivePpi(crop, s)) !== 'too-low')
    .sort((a, b) => b.widthMm * b.heightMm - a.widthMm * a.heightMm)[0];
}
