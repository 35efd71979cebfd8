import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { featherMask, fullMask, paintStrokes, plainBackgroundMask } from '#shared/imaging/mask.ts';
import { clusteredDot } from '#shared/imaging/halftone/clustered.ts';
import { grayF, toGrayF } from '#shared/imaging/image.ts';
import { renderMockup } from '#shared/imaging/mockup.ts';
import { insideShape } from '#shared/imaging/shape.ts';
import { estimateBurnSeconds } from '#shared/imaging/burn-time.ts';
import { pixelsFor } from '#shared/imaging/sizing.ts';
import { exposure, laplacianVariance } from '#shared/imaging/photo-checks.ts';
import { gaussianBlur } from '#shared/imaging/blur.ts';
import { renderBitmap } from '#shared/imaging/pipeline.ts';
import { pillowReadGray, referencePhotoDir } from '#tests/support/pillow.ts';

const rgba = (width: number, height: number, at: (x: number, y: number) => [number, number, number]) => {
  const data = new Uint8ClampedArray(width * height * 4);
  for (let y = 0; y < height; y++)
    for (let x = 0; x < width; x++) {
      const [r, g, b] = at(x, y);
      data.set([r, g, b, 255], (y * width + x) * 4);
    }
  return { width, height, data };
};

describe('cut-out mask', () => {
  it('paints keep and remove strokes of the given width', () => {
    const removed = paintStrokes(fullMask(40, 40), [
      {
        mode: 'remove',
        width: 10,
        points: [
          [0, 20],
          [40, 20],
        ],
      },
    ]);
    // A 10-pixel-wide band through the middle rows 15–24 is removed, the rest kept.
    expect(removed.data[20 * 40 + 20]).toBe(0);
    expect(removed.data[14 * 40 + 20]).toBe(1);
    const kept = paintStrokes(removed, [{ mode: 'keep', width: 4, points: [[20, 20]] }]);
    expect(kept.data[20 * 40 + 20]).toBe(1);
  });

  it('feathers the edge: coverage falls gradually across it, about half at the edge itself', () => {
    const mask = fullMask(60, 1);
    mask.data.fill(0, 30);
    const soft = featherMask({ ...mask, height: 1 }, 8).data;
    expect(soft[29]! + soft[30]!).toBeCloseTo(1, 1);
    expect(soft[20]!).toBeGreaterThan(0.95);
    expect(soft[26]!).toBeGreaterThan(soft[29]!);
    expect(soft[40]!).toBeLessThan(0.05);
  });

  it('finds a plain background by flood fill from the borders, within a colour tolerance', () => {
    // A dark disc on a slightly noisy light background.
    const image = rgba(50, 50, (x, y) => ((x - 25) ** 2 + (y - 25) ** 2 < 100 ? [40, 30, 20] : [235 + ((x * 7 + y * 3) % 9), 235, 230]));
    const mask = plainBackgroundMask(image, 24).data;
    expect(mask[0]).toBe(0);
    expect(mask[25 * 50 + 25]).toBe(1);
    const subject = mask.reduce((n, v) => n + v, 0);
    expect(subject).toBeGreaterThan(Math.PI * 100 * 0.85);
    expect(subject).toBeLessThan(Math.PI * 100 * 1.15);
  });
});

describe('clustered dots, mock-up, burn time, photo checks', () => {
  it('covers flat greys with about their share of black in clustered dots', () => {
    for (const v of [64, 128, 192]) {
      const bits = clusteredDot(grayF(240, 240, v), { cellsPerInch: 45, pixelsPerInch: 360, angleDegrees: 45 }).data;
      const black = bits.reduce((n, b) => n + (1 - b), 0) / bits.length;
      expect(Math.abs(black - (1 - v / 255)), `grey ${v}`).toBeLessThan(0.06);
    }
  });

  it('draws the mock-up in the material’s colours inside the blank’s shape', () => {
    const bitmap = { width: 200, height: 100, data: new Uint8Array(200 * 100).fill(0) };
    const oval = renderMockup({ bitmap, shape: 'oval', surfaceColour: '#101010', markColour: '#f0f0f0' });
    let opaque = 0;
    for (let i = 3; i < oval.data.length; i += 4) opaque += oval.data[i] === 255 ? 1 : 0;
    // An ellipse fills π/4 of its bounding box.
    expect(opaque / (200 * 100)).toBeCloseTo(Math.PI / 4, 2);
    expect([...oval.data.slice((50 * 200 + 100) * 4, (50 * 200 + 100) * 4 + 4)]).toEqual([240, 240, 240, 255]);
    expect(insideShape('circle', 0, 0, 100, 100)).toBe(false);
    expect(insideShape('rounded-rectangle', 0, 0, 100, 100)).toBe(false);
    expect(insideShape('rounded-rectangle', 0, 50, 100, 100)).toBe(true);
  });

  it('estimates burn time from rows, width, overscan, speed, turnaround and passes', () => {
    // Worked by hand: 100 × 100 mm at 254 lines per inch = 1000 rows; each row (100 + 2·5) mm at
    // 500 mm/s = 0.22 s, plus 0.05 s turnaround = 0.27 s; 1000 rows × 2 passes = 540 s.
    expect(estimateBurnSeconds({ widthMm: 100, heightMm: 100, linesPerInch: 254, speedMmPerSecond: 500, passes: 2 })).toBeCloseTo(540, 6);
    // One row per row of the engrave file: 25.5 mm at 100 lines per inch is 100.39 lines, which
    // placement rounds to 100 pixel rows; counting 101 would add a row that never burns.
    const rows = pixelsFor(25.5, 100);
    expect(rows).toBe(100);
    expect(estimateBurnSeconds({ widthMm: 100, heightMm: 25.5, linesPerInch: 100, speedMmPerSecond: 500, passes: 1 })).toBeCloseTo(
      rows * 0.27,
      6,
    );
  });

  it('scores a blurred photo as less sharp and reports clipped tones (scikit-image "camera", CC0)', () => {
    const photo = toGrayF(pillowReadGray(join(referencePhotoDir, 'camera.png')));
    const sharp = laplacianVariance(photo);
    const soft = laplacianVariance(gaussianBlur(photo, 2));
    expect(soft).toBeLessThan(sharp / 5);
    const clipped = exposure({ data: Float32Array.from(photo.data, (v) => (v < 128 ? 0 : v)) });
    expect(clipped.shadows).toBeGreaterThan(0.3);
  });

  it('runs the whole pipeline on a real photograph: negative, cut-out, halftone; nothing burns outside', () => {
    const gray = pillowReadGray(join(referencePhotoDir, 'camera.png'));
    const photo = rgba(gray.width, gray.height, (x, y) => {
      const v = gray.data[y * gray.width + x]!;
      return [v, v, v];
    });
    const bitmap = renderBitmap(photo, {
      negative: true,
      sharpen: { amount: 200, radius: 1.5, threshold: 2 },
      cutout: {
        strokes: [
          {
            mode: 'remove',
            width: 100,
            points: [
              [0, 0],
              [511, 0],
            ],
          },
        ],
        featherRadius: 6,
      },
      halftone: { method: 'jarvis-judice-ninke' },
    });
    expect([bitmap.width, bitmap.height]).toEqual([512, 512]);
    // The removed band along the top (50 px, plus feather) fires nothing: all white.
    expect([...bitmap.data.slice(0, 512 * 40)].every((b) => b === 1)).toBe(true);
    // Inside, a negative of a mostly mid-dark photo fires a fair share of dots.
    const inside = bitmap.data.slice(512 * 80);
    const fired = inside.reduce((n, b) => n + (1 - b), 0) / inside.length;
    expect(fired).toBeGreaterThan(0.2);
    expect(fired).toBeLessThan(0.8);
  });
});
