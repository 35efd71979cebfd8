/**
 * Physical size ↔ pixels. 1 inch = 25.4 mm exactly (International Yard and Pound Agreement, 1959).
 * The output is the engraving area times the line density, rounded to the nearest whole pixel
 * (half up), never below one: an 8 × 10 in area at 360 lines per inch is 2880 × 3600 pixels.
 */
export const MM_PER_INCH = 25.4;

export const mmToInches = (mm: number) => mm / MM_PER_INCH;
export const inchesToMm = (inches: number) => inches * MM_PER_INCH;

export function pixelsFor(mm: number, linesPerInch: number): number {
  return Math.max(1, Math.round((mm / MM_PER_INCH) * linesPerInch));
}

export function outputSize(area: { widthMm: number; heightMm: number }, linesPerInch: number): { width: number; height: number } {
  return { width: pixelsFor(area.widthMm, linesPerInch), height: pixelsFor(area.heightMm, linesPerInch) };
}

/**
 * The engraving area turned as the buyer chose: a size's area is stored as entered, either way
 * round, and an order item is portrait or landscape.
 */
export function orientedArea(
  size: { areaWidthMm: number; areaHeightMm: number },
  orientation: 'portrait' | 'landscape',
): { widthMm: number; heightMm: number } {
  const [short, long] = [Math.min(size.areaWidthMm, size.areaHeightMm), Math.max(size.areaWidthMm, size.areaHeightMm)];
  return orientation === 'portrait' ? { widthMm: short, heightMm: long } : { widthMm: long, heightMm: short };
}

/**
 * How far a photo's framing may differ in proportions from its engraving area (0.5 %): the
 * window is resampled to fill the area, so any more would visibly stretch the photo. The
 * designer's windows always have the area's proportions, up to a hundredth of a pixel.
 */
export const CROP_ASPECT_TOLERANCE = 0.005;

export function cropMatchesArea(crop: { width: number; height: number }, area: { widthMm: number; heightMm: number }): boolean {
  return Math.abs(crop.width / crop.height / (area.widthMm / area.heightMm) - 1) <= CROP_ASPECT_TOLERANCE;
}
