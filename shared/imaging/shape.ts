/**
 * The blank's shape, and what it means for a piece. The burn is clipped to the shape fitted to
 * the engraving area (a circle of the area's shorter side, an oval touching its four sides, a
 * rectangle with rounded corners, or the whole area): the mock-up, the proof, the 1:1 region, the
 * engrave file and the grayscale master all test pixels with `insideShape`, so they agree dot
 * for dot. A size's engraving area must itself fit inside the blank's outline, centred.
 */
export const BLANK_SHAPES = ['rectangle', 'rounded-rectangle', 'oval', 'circle'] as const;
export type BlankShape = (typeof BLANK_SHAPES)[number];

/** Corner radius of a rounded rectangle, as a share of its shorter side. */
export const CORNER_SHARE = 0.08;

/**
 * Whether the point (px, py) lies inside the shape drawn in a w × h box whose top left is the
 * origin. Circle: (px − w/2)² + (py − h/2)² ≤ (min(w, h)/2)². Oval: ((px − w/2)/(w/2))² +
 * ((py − h/2)/(h/2))² ≤ 1. Rounded rectangle: inside the box and within r of the nearest point
 * of the box shrunk by r on every side, r = CORNER_SHARE × min(w, h).
 */
export function pointInShape(shape: BlankShape, px: number, py: number, w: number, h: number): boolean {
  if (px < 0 || py < 0 || px > w || py > h) return false;
  switch (shape) {
    case 'rectangle':
      return true;
    case 'oval': {
      const dx = (px - w / 2) / (w / 2);
      const dy = (py - h / 2) / (h / 2);
      return dx * dx + dy * dy <= 1;
    }
    case 'circle': {
      const r = Math.min(w, h) / 2;
      const dx = px - w / 2;
      const dy = py - h / 2;
      return dx * dx + dy * dy <= r * r;
    }
    case 'rounded-rectangle': {
      const r = Math.min(w, h) * CORNER_SHARE;
      const cx = px < r ? r : px > w - r ? w - r : px;
      const cy = py < r ? r : py > h - r ? h - r : py;
      const dx = px - cx;
      const dy = py - cy;
      return dx * dx + dy * dy <= r * r;
    }
  }
}

/** Whether pixel (x, y) of a w × h image is inside the shape: its centre decides. */
export function insideShape(shape: BlankShape, x: number, y: number, w: number, h: number): boolean {
  return pointInShape(shape, x + 0.5, y + 0.5, w, h);
}

/**
 * The shape as an on/off mask (1 inside) for rows `top` … `top + rows − 1` of a width × height
 * image, so a band of a large file gets its own part. Undefined for a rectangle: everything is in.
 */
export function shapeMask(shape: BlankShape, width: number, height: number, top = 0, rows = height - top): Uint8Array | undefined {
  if (shape === 'rectangle') return undefined;
  const out = new Uint8Array(width * rows);
  for (let y = 0; y < rows; y++) {
    // Each row is one run between the shape's two edges (all four shapes are convex).
    let x0 = 0;
    while (x0 < width && !insideShape(shape, x0, top + y, width, height)) x0++;
    if (x0 === width) continue;
    let x1 = width - 1;
    while (x1 > x0 && !insideShape(shape, x1, top + y, width, height)) x1--;
    out.fill(1, y * width + x0, y * width + x1 + 1);
  }
  return out;
}

/**
 * Whether a w × h engraving area, centred on the blank, lies inside its outline (outer width ×
 * height): all four corners must be inside, which for these convex shapes means the whole area.
 */
export function areaFitsShape(
  shape: BlankShape,
  outer: { widthMm: number; heightMm: number },
  area: { widthMm: number; heightMm: number },
): boolean {
  const { widthMm: W, heightMm: H } = outer;
  const left = (W - area.widthMm) / 2;
  const top = (H - area.heightMm) / 2;
  const corners: Array<[number, number]> = [
    [left, top],
    [left + area.widthMm, top],
    [left, top + area.heightMm],
    [left + area.widthMm, top + area.heightMm],
  ];
  // A hair of tolerance so that an area typed to the largest size offered is taken.
  const slack = 1e-6;
  return corners.every(([x, y]) => pointInShape(shape, clampNear(x, W / 2, slack), clampNear(y, H / 2, slack), W, H));
}

const clampNear = (v: number, centre: number, slack: number) => (v < centre ? v + slack : v - slack);

/**
 * The largest area of the given proportions that fits inside the outline, rounded down to a tenth
 * of a millimetre (what a person types). Found by bisection on the scale, since `areaFitsShape`
 * is monotone in it.
 */
export function largestFittingArea(
  shape: BlankShape,
  outer: { widthMm: number; heightMm: number },
  aspect: { widthMm: number; heightMm: number },
): { widthMm: number; heightMm: number } {
  const unit = Math.max(aspect.widthMm, aspect.heightMm);
  const [aw, ah] = [aspect.widthMm / unit, aspect.heightMm / unit];
  let lo = 0;
  let hi = Math.max(outer.widthMm, outer.heightMm) * 2;
  for (let i = 0; i < 60; i++) {
    const mid = (lo + hi) / 2;
    if (areaFitsShape(shape, outer, { widthMm: aw * mid, heightMm: ah * mid })) lo = mid;
    else hi = mid;
  }
  const down = (v: number) => Math.floor(v * 10 + 1e-9) / 10;
  return { widthMm: down(aw * lo), heightMm: down(ah * lo) };
}

const SHAPE_WORDS: Record<BlankShape, string> = { rectangle: 'rectangular', 'rounded-rectangle': 'rounded', oval: 'oval', circle: 'round' };

/** A size's area against its blank's outline: whether it fits, and the largest that would. */
export function sizeFit(
  shape: BlankShape,
  size: { outerWidthMm: number; outerHeightMm: number; areaWidthMm: number; areaHeightMm: number },
): { fits: boolean; largest: { widthMm: number; heightMm: number } } {
  const outer = { widthMm: size.outerWidthMm, heightMm: size.outerHeightMm };
  const area = { widthMm: size.areaWidthMm, heightMm: size.areaHeightMm };
  return { fits: areaFitsShape(shape, outer, area), largest: largestFittingArea(shape, outer, area) };
}

/**
 * Why an area does not fit, in words, with the largest that does; `format` writes a width ×
 * height as typed, `formatDown` rounded down (so the size offered really fits).
 */
export function sizeFitMessage(
  shape: BlankShape,
  size: { areaWidthMm: number; areaHeightMm: number },
  largest: { widthMm: number; heightMm: number },
  format: (widthMm: number, heightMm: number) => string,
  formatDown = format,
): string {
  return `A ${format(size.areaWidthMm, size.areaHeightMm)} engraving area reaches past the edge of this ${SHAPE_WORDS[shape]} blank. The largest area of these proportions that fits is ${formatDown(largest.widthMm, largest.heightMm)}.`;
}
