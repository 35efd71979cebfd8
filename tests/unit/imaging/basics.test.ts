import { describe, expect, it } from 'vitest';
import { bayerMatrix, orderedDither } from '#shared/imaging/halftone/ordered.ts';
import { grayF } from '#shared/imaging/image.ts';
import { LUMA_WEIGHTS, linearToSrgb, rgbaToGray, srgbToLinear } from '#shared/imaging/luma.ts';
import { inchesToMm, mmToInches, outputSize } from '#shared/imaging/sizing.ts';
import { effectivePpi, largestFairOffered, largestFairSize, verdictFor } from '#shared/imaging/photo-checks.ts';

describe('Bayer ordered dither', () => {
  // B. E. Bayer, IEEE ICC 1973; matrices as tabulated in IMAGING-REFERENCES (recursion M2n).
  it('builds the published 2×2, 4×4 and 8×8 matrices', () => {
    expect(bayerMatrix(2)).toEqual([
      [0, 2],
      [3, 1],
    ]);
    expect(bayerMatrix(4)).toEqual([
      [0, 8, 2, 10],
      [12, 4, 14, 6],
      [3, 11, 1, 9],
      [15, 7, 13, 5],
    ]);
    const m8 = bayerMatrix(8);
    expect(m8[0]).toEqual([0, 32, 8, 40, 2, 34, 10, 42]);
    expect(m8[1]).toEqual([48, 16, 56, 24, 50, 18, 58, 26]);
    expect(new Set(m8.flat()).size).toBe(64);
  });

  it('gives a flat grey v exactly the share of white dots its thresholds allow', () => {
    for (const size of [2, 4, 8] as const) {
      const cells = size * size;
      for (const v of [0, 10, 64, 127.5, 128, 200, 255]) {
        const bits = orderedDither(grayF(size * 4, size * 4, v), size).data;
        const expected =
          bayerMatrix(size)
            .flat()
            .filter((m) => v > (255 * (m + 0.5)) / cells).length / cells;
        expect(bits.reduce((n, b) => n + b, 0) / bits.length, `${size}×${size} at ${v}`).toBe(expected);
      }
    }
  });
});

describe('grayscale', () => {
  const pixel = (r: number, g: number, b: number, mode?: Parameters<typeof rgbaToGray>[1]) =>
    rgbaToGray({ width: 1, height: 1, data: new Uint8Array([r, g, b, 255]) }, mode).data[0]!;

  it('uses BT.709-6 and BT.601-7 weights on primaries and random colours', () => {
    // ITU-R BT.709-6: 0.2126 R' + 0.7152 G' + 0.0722 B'; ITU-R BT.601-7: 0.299, 0.587, 0.114.
    expect(LUMA_WEIGHTS.bt709).toEqual([0.2126, 0.7152, 0.0722]);
    expect(LUMA_WEIGHTS.bt601).toEqual([0.299, 0.587, 0.114]);
    expect(pixel(255, 0, 0)).toBeCloseTo(54.213, 3);
    expect(pixel(0, 255, 0)).toBeCloseTo(182.376, 3);
    expect(pixel(0, 0, 255)).toBeCloseTo(18.411, 3);
    // Pillow's convert('L') rounds BT.601 to 76, 150, 29 on the primaries (Pillow docs, Image.convert).
    expect([pixel(255, 0, 0, 'bt601'), pixel(0, 255, 0, 'bt601'), pixel(0, 0, 255, 'bt601')].map(Math.round)).toEqual([76, 150, 29]);
    let seed = 7;
    const random = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) % 256;
    for (let i = 0; i < 200; i++) {
      const [r, g, b] = [random(), random(), random()];
      expect(pixel(r, g, b)).toBeCloseTo(0.2126 * r + 0.7152 * g + 0.0722 * b, 3);
      expect(pixel(r, g, b, 'bt601')).toBeCloseTo(0.299 * r + 0.587 * g + 0.114 * b, 3);
    }
  });

  it('follows the sRGB transfer curve of IEC 61966-2-1', () => {
    expect(srgbToLinear(0.04045)).toBeCloseTo(0.04045 / 12.92, 12);
    expect(srgbToLinear(0.5)).toBeCloseTo(((0.5 + 0.055) / 1.055) ** 2.4, 12);
    expect(linearToSrgb(0.0031308)).toBeCloseTo(12.92 * 0.0031308, 12);
    expect(linearToSrgb(0.2)).toBeCloseTo(1.055 * 0.2 ** (1 / 2.4) - 0.055, 12);
    for (let v = 0; v <= 1; v += 0.01) expect(linearToSrgb(srgbToLinear(v))).toBeCloseTo(v, 9);
    // Linear-light luma of pure red: 255 · encode(0.2126) ≈ 127, as libvips reports (IMAGING-REFERENCES).
    expect(Math.round(pixel(255, 0, 0, 'linear709'))).toBe(127);
  });
});

describe('sizes and photo checks', () => {
  it('converts with 1 in = 25.4 mm exactly (International Yard and Pound Agreement, 1959)', () => {
    expect(inchesToMm(1)).toBe(25.4);
    expect(mmToInches(254)).toBe(10);
    expect(inchesToMm(8)).toBeCloseTo(203.2, 12);
  });

  it('sizes the output for worked examples: 8 × 10 in at 360 and at 1000 lines per inch', () => {
    expect(outputSize({ widthMm: 203.2, heightMm: 254 }, 360)).toEqual({ width: 2880, height: 3600 });
    expect(outputSize({ widthMm: 203.2, heightMm: 254 }, 1000)).toEqual({ width: 8000, height: 10000 });
    expect(outputSize({ widthMm: 100, heightMm: 100 }, 254)).toEqual({ width: 1000, height: 1000 });
  });

  it('gives the verdicts of print practice (≥ 300 good, 150–300 fair, < 150 too low) on hand-computed cases', () => {
    const area8x10 = { widthMm: 203.2, heightMm: 254 };
    // 2400 × 3000 px over 8 × 10 in: 300 ppi on both axes.
    expect(effectivePpi({ width: 2400, height: 3000 }, area8x10)).toBeCloseTo(300, 9);
    expect(verdictFor(300)).toBe('good');
    // 1600 × 2000 px: 200 ppi → fair. 240 × 320 px: 30 ppi → too low.
    expect(verdictFor(effectivePpi({ width: 1600, height: 2000 }, area8x10))).toBe('fair');
    expect(effectivePpi({ width: 240, height: 320 }, area8x10)).toBeCloseTo(30, 9);
    expect(verdictFor(149.99)).toBe('too-low');
    // The weaker axis decides: 2400 × 1500 px over 8 × 10 in is 150 ppi.
    expect(effectivePpi({ width: 2400, height: 1500 }, area8x10)).toBeCloseTo(150, 9);
    // 240 × 320 px over 8 × 10 in is 30 ppi; at the same proportions it stays fair up to
    // 8 · 30/150 = 1.6 by 10 · 30/150 = 2 in.
    const fair = largestFairSize({ width: 240, height: 320 }, area8x10);
    expect(mmToInches(fair.widthMm)).toBeCloseTo(1.6, 9);
    expect(mmToInches(fair.heightMm)).toBeCloseTo(2, 9);
  });

  it('suggests the largest offered size that stays fair', () => {
    const sizes = [
      { label: '4 × 6 in', widthMm: 101.6, heightMm: 152.4 },
      { label: '5 × 7 in', widthMm: 127, heightMm: 177.8 },
      { label: '8 × 10 in', widthMm: 203.2, heightMm: 254 },
    ];
    // 900 × 1200 px: 8 × 10 gives 112.5 ppi (too low), 5 × 7 gives 171 ppi (fair).
    expect(largestFairOffered({ width: 900, height: 1200 }, sizes)?.label).toBe('5 × 7 in');
    expect(largestFairOffered({ width: 100, height: 100 }, sizes)).toBeUndefined();
  });
});
