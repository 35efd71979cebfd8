import type { GrayF, Rgba8 } from './image.ts';
import { gaussianBlur } from './blur.ts';

/**
 * The cut-out: a coverage mask, 0 (outside the subject, never burned) … 1 (inside). Made from
 * brush strokes, from an uploaded image's alpha, or from a "plain background" flood fill; its
 * edge is softened by a Gaussian (the feather), and the halftone sees only pixels with coverage.
 */
export type Mask = { width: number; height: number; data: Float32Array };

export type Stroke = { mode: 'keep' | 'remove'; width: number; points: Array<[number, number]> };

export function fullMask(width: number, height: number, value = 1): Mask {
  return { width, height, data: new Float32Array(width * height).fill(value) };
}

export function maskFromAlpha(image: Rgba8): Mask {
  const data = new Float32Array(image.width * image.height);
  for (let i = 0; i < data.length; i++) data[i] = image.data[i * 4 + 3]! / 255;
  return { width: image.width, height: image.height, data };
}

/** Paints strokes onto a mask in order: a keep stroke sets coverage 1, a remove stroke 0. */
export function paintStrokes(start: Mask, strokes: Stroke[]): Mask {
  const out: Mask = { ...start, data: start.data.slice() };
  for (const stroke of strokes) {
    const value = stroke.mode === 'keep' ? 1 : 0;
    const r = stroke.width / 2;
    const pts = stroke.points.length === 1 ? [stroke.points[0]!, stroke.points[0]!] : stroke.points;
    for (let s = 1; s < pts.length; s++) {
      const [x0, y0] = pts[s - 1]!;
      const [x1, y1] = pts[s]!;
      const minX = Math.max(0, Math.floor(Math.min(x0, x1) - r));
      const maxX = Math.min(out.width - 1, Math.ceil(Math.max(x0, x1) + r));
      const minY = Math.max(0, Math.floor(Math.min(y0, y1) - r));
      const maxY = Math.min(out.height - 1, Math.ceil(Math.max(y0, y1) + r));
      const dx = x1 - x0;
      const dy = y1 - y0;
      const len2 = dx * dx + dy * dy;
      for (let y = minY; y <= maxY; y++) {
        for (let x = minX; x <= maxX; x++) {
          // Distance from the pixel centre to the segment.
          const px = x + 0.5 - x0;
          const py = y + 0.5 - y0;
          const t = len2 ? Math.max(0, Math.min(1, (px * dx + py * dy) / len2)) : 0;
          const ex = px - t * dx;
          const ey = py - t * dy;
          if (ex * ex + ey * ey <= r * r) out.data[y * out.width + x] = value;
        }
      }
    }
  }
  return out;
}

/** Softens the mask's edge: a Gaussian of σ = radius / 2 pixels, so the edge fades over about `radius`. */
export function featherMask(mask: Mask, radius: number): Mask {
  if (radius <= 0) return mask;
  const blurred = gaussianBlur({ width: mask.width, height: mask.height, data: mask.data }, radius / 2);
  return { width: mask.width, height: mask.height, data: blurred.data };
}

/**
 * The cut-out as the pipeline applies it: a start (the photo's alpha, a plain-background fill,
 * or everything), the brush strokes painted on it in order, then the feather. The one builder
 * for the burn, the grayscale master and the mock-up's faded photo view.
 */
export function cutoutMask(start: Mask, cutout: { strokes?: Stroke[]; featherRadius?: number }): Mask {
  const painted = cutout.strokes?.length ? paintStrokes(start, cutout.strokes) : start;
  return cutout.featherRadius ? featherMask(painted, cutout.featherRadius) : painted;
}

/** Whether a cut-out changes anything beyond the photo's own alpha: a start of its own or strokes. */
export const hasCutout = (cutout: { strokes?: Stroke[]; startMask?: Mask } | undefined): boolean =>
  Boolean(cutout?.startMask || cutout?.strokes?.length);

/**
 * A starting mask for a photo on a plain background: flood fill from every border pixel through
 * neighbours whose colour is within `tolerance` (Euclidean RGB distance) of the border pixel the
 * fill started from. Filled pixels are background (0); the rest is the subject (1).
 */
export function plainBackgroundMask(image: Rgba8, tolerance = 24): Mask {
  const { width, height, data } = image;
  const mask = fullMask(width, height, 1);
  const seen = new Uint8Array(width * height);
  const queue = new Int32Array(width * height);
  const t2 = tolerance * tolerance;
  const border: number[] = [];
  for (let x = 0; x < width; x++) border.push(x, (height - 1) * width + x);
  for (let y = 0; y < height; y++) border.push(y * width, y * width + width - 1);
  for (const seed of border) {
    if (seen[seed]) continue;
    const sr = data[seed * 4]!;
    const sg = data[seed * 4 + 1]!;
    const sb = data[seed * 4 + 2]!;
    let head = 0;
    let tail = 0;
    queue[tail++] = seed;
    seen[seed] = 1;
    while (head < tail) {
      const p = queue[head++]!;
      mask.data[p] = 0;
      const x = p % width;
      const neighbours = [x > 0 ? p - 1 : -1, x < width - 1 ? p + 1 : -1, p - width, p + width];
      for (const n of neighbours) {
        if (n < 0 || n >= width * height || seen[n]) continue;
        const dr = data[n * 4]! - sr;
        const dg = data[n * 4 + 1]! - sg;
        const db = data[n * 4 + 2]! - sb;
        if (dr * dr + dg * dg + db * db > t2) continue;
        seen[n] = 1;
        queue[tail++] = n;
      }
    }
  }
  return mask;
}

/**
 * Applies coverage to a gray image as the halftone will see it: outside the subject the image
 * becomes white (nothing burned on a positive), and the returned on/off mask marks where the
 * halftone runs at all. Partial coverage fades the tone towards white, which is the feather.
 */
export function applyMask(image: GrayF, mask: Mask, background = 255): { image: GrayF; inside: Uint8Array | undefined } {
  const out = new Float32Array(image.data.length);
  const inside = new Uint8Array(image.data.length);
  let outside = 0;
  for (let i = 0; i < out.length; i++) {
    const c = mask.data[i]!;
    out[i] = image.data[i]! * c + background * (1 - c);
    const on = c > 0.004 ? 1 : 0;
    inside[i] = on;
    outside += 1 - on;
  }
  // No pixel outside the subject: no mask, and the halftone takes its faster path.
  return { image: { width: image.width, height: image.height, data: out }, inside: outside ? inside : undefined };
}
