import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { readPngFacts } from '#server/imaging/png-1bit.ts';
import { burnPiece, writePieceMaster, type Piece } from '#server/imaging/piece.ts';
import { placePhoto } from '#server/imaging/placement.ts';
import { applyMask } from '#shared/imaging/mask.ts';
import { prepareGray } from '#shared/imaging/pipeline.ts';
import { largestFittingArea, type BlankShape } from '#shared/imaging/shape.ts';
import { gradeSettings, pipelineSettings, prepAtWidth, recipePrep } from '#shared/orders/prep-pipeline.ts';
import { pillowOpen, referencePhotoDir } from '#tests/support/pillow.ts';

/**
 * The one pipeline behind every picture of a piece, checked from outside: geometry written out
 * here independently of the product's shape code, the published mean-preserving property of
 * error diffusion, and the PNG specification's pHYs.
 */
const photo = () => readFileSync(join(referencePhotoDir, 'astronaut.png')); // scikit-image "astronaut", NASA, public domain
const slate = recipePrep({ tone: 'negative', halftoneMethod: 'floyd-steinberg', linesPerInch: 254 });

/**
 * Point-in-shape on pixel centres, from the formulas (geometry, no other source): circle
 * (x − cx)² + (y − cy)² ≤ r² with r = min(w, h) / 2; ellipse ((x − cx)/a)² + ((y − cy)/b)² ≤ 1
 * with a = w / 2, b = h / 2; rounded rectangle: within r = 0.08 · min(w, h) of the rectangle
 * [r, w − r] × [r, h − r].
 */
function inside(shape: BlankShape, x: number, y: number, w: number, h: number): boolean {
  const [px, py] = [x + 0.5, y + 0.5];
  if (shape === 'rectangle') return true;
  if (shape === 'circle') return (px - w / 2) ** 2 + (py - h / 2) ** 2 <= (Math.min(w, h) / 2) ** 2;
  if (shape === 'oval') return ((px - w / 2) / (w / 2)) ** 2 + ((py - h / 2) / (h / 2)) ** 2 <= 1;
  const r = 0.08 * Math.min(w, h);
  const dx = Math.max(r - px, 0, px - (w - r));
  const dy = Math.max(r - py, 0, py - (h - r));
  return dx * dx + dy * dy <= r * r;
}

const square = { crop: { left: 0, top: 0, width: 512, height: 512 } };
const wide = { crop: { left: 0, top: 85.33, width: 512, height: 341.33 } };

describe('the blank’s shape clips every burn', () => {
  it.each<[BlankShape, Piece['placement'], { widthMm: number; heightMm: number }]>([
    ['circle', square, { widthMm: 70, heightMm: 70 }],
    ['oval', wide, { widthMm: 60, heightMm: 40 }],
    ['rounded-rectangle', wide, { widthMm: 60, heightMm: 40 }],
    ['rectangle', wide, { widthMm: 60, heightMm: 40 }],
  ])('fires no dot outside a %s, lettering included', async (shape, placement, area) => {
    // A long inscription near the bottom edge: on a round piece its ends lie outside the circle.
    const piece: Piece = {
      placement,
      area,
      shape,
      inscription: { lines: ['Nell and Bram, summer by the harbour'], font: 'rounded-bold', size: 0.09 },
    };
    const { bitmap } = await burnPiece(photo(), piece, slate);
    let firedOutside = 0;
    let firedInside = 0;
    let insideCount = 0;
    for (let y = 0; y < bitmap.height; y++)
      for (let x = 0; x < bitmap.width; x++) {
        const fired = bitmap.data[y * bitmap.width + x] === 0;
        if (inside(shape, x, y, bitmap.width, bitmap.height)) {
          insideCount++;
          if (fired) firedInside++;
        } else if (fired) firedOutside++;
      }
    expect(firedOutside).toBe(0);
    // And it still burns the picture inside.
    expect(firedInside / insideCount).toBeGreaterThan(0.2);
  });

  it('would otherwise fire a quarter of a round coaster’s dots past the circle (the defect this guards)', async () => {
    const area = { widthMm: 70, heightMm: 70 };
    const { bitmap } = await burnPiece(photo(), { placement: square, area, shape: 'rectangle', inscription: null }, slate);
    let outside = 0;
    let fired = 0;
    for (let y = 0; y < bitmap.height; y++)
      for (let x = 0; x < bitmap.width; x++) {
        if (bitmap.data[y * bitmap.width + x] !== 0) continue;
        fired++;
        if (!inside('circle', x, y, bitmap.width, bitmap.height)) outside++;
      }
    // The corners outside the inscribed circle are 1 − π/4 ≈ 21 % of the square.
    expect(outside / fired).toBeGreaterThan(0.1);
  });

  it('keeps the mean: fired dots over the area match the prepared grayscale within 1 % (error diffusion preserves the mean; Floyd & Steinberg 1976)', async () => {
    for (const shape of ['circle', 'oval'] as const) {
      const area = { widthMm: 60, heightMm: 40 };
      const piece: Piece = { placement: wide, area, shape, inscription: null };
      const { placed, settings, bitmap } = await burnPiece(photo(), piece, slate);
      const { gray, mask } = prepareGray(placed, settings);
      const { image, inside: on } = applyMask(gray, mask!);
      let ink = 0;
      let dots = 0;
      let n = 0;
      for (let i = 0; i < image.data.length; i++) {
        if (!on![i]) continue;
        n++;
        ink += 1 - Math.min(255, Math.max(0, image.data[i]!)) / 255;
        dots += bitmap.data[i] === 0 ? 1 : 0;
      }
      expect(Math.abs(dots / n - ink / n), shape).toBeLessThan(0.01);
    }
  });

  it('offers the largest area that fits: a square in a circle has side d / √2, in an ellipse the corner lies on it', () => {
    expect(largestFittingArea('circle', { widthMm: 100, heightMm: 100 }, { widthMm: 1, heightMm: 1 })).toEqual({
      widthMm: 70.7,
      heightMm: 70.7,
    });
    const oval = largestFittingArea('oval', { widthMm: 120, heightMm: 80 }, { widthMm: 5, heightMm: 3 });
    // (w / 120)² + (h / 80)² = 1/4 · … at the corner (w/2, h/2): ((w/2)/60)² + ((h/2)/40)² ≤ 1.
    expect((oval.widthMm / 2 / 60) ** 2 + (oval.heightMm / 2 / 40) ** 2).toBeLessThanOrEqual(1);
    expect(((oval.widthMm + 0.2) / 2 / 60) ** 2 + ((oval.heightMm + 0.12) / 2 / 40) ** 2).toBeGreaterThan(1);
  });
});

describe('the grayscale master', () => {
  it('is written at 1000 ppi with pHYs 39370 px/m (PNG specification, pHYs chunk), transparent outside the shape, and read back by Pillow', async () => {
    const piece: Piece = { placement: square, area: { widthMm: 25.4, heightMm: 25.4 }, shape: 'circle', inscription: null };
    const burned = await burnPiece(photo(), piece, slate);
    const master = await writePieceMaster(piece, slate, burned, 1000);
    expect([master.width, master.height]).toEqual([1000, 1000]);
    expect(readPngFacts(master.png)).toMatchObject({ width: 1000, height: 1000, bitDepth: 8, colourType: 4, pixelsPerMetre: 39370 });
    const read = pillowOpen(master.png);
    expect(read.mode).toBe('LA');
    expect(Math.abs(read.dpi[0] - 1000)).toBeLessThan(0.01);
    let opaqueOutside = 0;
    let clearInside = 0;
    for (let y = 0; y < 1000; y++)
      for (let x = 0; x < 1000; x++) {
        const a = read.bytes[(y * 1000 + x) * 2 + 1]!;
        if (inside('circle', x, y, 1000, 1000)) clearInside += a === 0 ? 1 : 0;
        else opaqueOutside += a > 0 ? 1 : 0;
      }
    expect(opaqueOutside).toBe(0);
    expect(clearInside).toBe(0);
  }, 60_000);

  it('is the same written in bands as prepared in one piece', async () => {
    // 60 × 40 mm at 400 ppi: 945 × 630 pixels, three bands of 256 rows.
    const piece: Piece = { placement: wide, area: { widthMm: 60, heightMm: 40 }, shape: 'oval', inscription: null };
    const burned = await burnPiece(photo(), piece, slate);
    const master = await writePieceMaster(piece, slate, burned, 400);
    // sharp opens gray + alpha as four channels (gray repeated, then alpha).
    const { data, info } = await sharp(master.png).raw().toBuffer({ resolveWithObject: true });
    const c = info.channels;
    const placed = await placePhoto(photo(), piece.placement, piece.area, 400);
    const whole = prepareGray(placed, {
      ...gradeSettings(prepAtWidth(slate, 60, placed.width), 'oval'),
      autoLevelsClip: undefined,
      levels: burned.levels,
    });
    let worst = 0;
    let worstAlpha = 0;
    for (let i = 0; i < placed.width * placed.height; i++) {
      const alpha = Math.round(whole.mask!.data[i]! * 255);
      worstAlpha = Math.max(worstAlpha, Math.abs(data[i * c + c - 1]! - alpha));
      if (alpha) worst = Math.max(worst, Math.abs(data[i * c]! - Math.min(255, Math.max(0, Math.round(whole.gray.data[i]!)))));
    }
    // The box-approximated blur restarts at each band's edge rows; the overlap keeps it exact to rounding.
    expect(worstAlpha).toBeLessThanOrEqual(1);
    expect(worst).toBeLessThanOrEqual(1);
  }, 60_000);
});

describe('one look from the storefront to the laser', () => {
  /** Mean of each `factor` × `factor` block (a box reduction). */
  const boxReduce = (data: ArrayLike<number>, width: number, height: number, factor: number, stride = 1) => {
    const [w, h] = [Math.floor(width / factor), Math.floor(height / factor)];
    const out = new Float64Array(w * h);
    for (let y = 0; y < h * factor; y++)
      for (let x = 0; x < w * factor; x++)
        out[Math.floor(y / factor) * w + Math.floor(x / factor)]! += data[(y * width + x) * stride]! / (factor * factor);
    return out;
  };
  const meanAbsoluteDifference = (a: ArrayLike<number>, b: ArrayLike<number>, side: number) => {
    let sum = 0;
    let n = 0;
    // Inside the circle, away from its edge, where every picture has coverage.
    for (let y = 0; y < side; y++)
      for (let x = 0; x < side; x++) {
        if ((x + 0.5 - side / 2) ** 2 + (y + 0.5 - side / 2) ** 2 > (side / 2 - 4) ** 2) continue;
        sum += Math.abs(a[y * side + x]! - b[y * side + x]!);
        n++;
      }
    return sum / n;
  };

  it('the mock-up, the proof and the box-reduced master prepare the photo alike: mean absolute difference ≤ 8 grey levels', async () => {
    // A 3 in round piece: the mock-up at 300 pixels, the proof at 900, the master at 3000 (1000 ppi).
    const piece: Piece = { placement: square, area: { widthMm: 76.2, heightMm: 76.2 }, shape: 'circle', inscription: null };
    // What the storefront's worker does at the screen's size (it places with a canvas; sharp here).
    const grayAt = async (width: number, prep = prepAtWidth(slate, 76.2, width)) => {
      const placed = await placePhoto(photo(), piece.placement, piece.area, prep.linesPerInch);
      return prepareGray(placed, pipelineSettings(prep, placed, 'circle')).gray.data;
    };
    const mockup = await grayAt(300);
    const proof = boxReduce(await grayAt(900), 900, 900, 3);
    const burned = await burnPiece(photo(), piece, slate);
    const master = await writePieceMaster(piece, slate, burned, 1000);
    const { data, info } = await sharp(master.png).raw().toBuffer({ resolveWithObject: true });
    const masterReduced = boxReduce(data, 3000, 3000, 10, info.channels);
    // Measured: 3.1, 2.9 and 4.9 grey levels.
    expect(meanAbsoluteDifference(mockup, masterReduced, 300)).toBeLessThanOrEqual(8);
    expect(meanAbsoluteDifference(proof, masterReduced, 300)).toBeLessThanOrEqual(8);
    expect(meanAbsoluteDifference(mockup, proof, 300)).toBeLessThanOrEqual(8);
    // The storefront's old settings of its own (150 %, radius 1 screen pixel, no contrast, no
    // auto levels) were further off: this check tells them apart.
    const oldLook = await grayAt(300, { ...prepAtWidth(slate, 76.2, 300), sharpenRadius: 1, contrast: 0, autoLevels: false });
    // Measured: 7.7 against the master.
    expect(meanAbsoluteDifference(oldLook, masterReduced, 300)).toBeGreaterThan(meanAbsoluteDifference(mockup, masterReduced, 300));
  }, 60_000);
});

describe('quarter turns', () => {
  it.each([-90, 90, 180])(
    'a %i° turn of a window that covers the photo leaves no transparent pixel (odd and even sides)',
    async (rotation) => {
      for (const [pw, ph] of [
        [640, 427],
        [601, 400],
      ] as const) {
        const bytes = await sharp({ create: { width: pw, height: ph, channels: 3, background: '#808080' } })
          .png()
          .toBuffer();
        const [w, h] = Math.abs(rotation) === 90 ? [ph, pw] : [pw, ph];
        // At 100 lines per inch and an area of w × h hundredths of an inch, one window pixel is one output pixel.
        const placed = await placePhoto(
          bytes,
          { crop: { left: (pw - w) / 2, top: (ph - h) / 2, width: w, height: h }, rotation },
          { widthMm: (w * 25.4) / 100, heightMm: (h * 25.4) / 100 },
          100,
        );
        expect([placed.width, placed.height]).toEqual([w, h]);
        let clear = 0;
        for (let i = 3; i < placed.data.length; i += 4) clear += placed.data[i] === 255 ? 0 : 1;
        expect(clear, `${pw} × ${ph}`).toBe(0);
      }
    },
  );
});
