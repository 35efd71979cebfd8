import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import * as fontkit from 'fontkit';
import { describe, expect, it } from 'vitest';
import { burnInscription, inscriptionCoverage } from '#server/imaging/inscription.ts';

/**
 * The inscription burned into the engrave file: laid out as the storefront draws it, in the same
 * Nunito files. The letter height is checked against the font's own cap height as fontkit (an
 * independent font reader, PDFKit's) reads it from the OS/2 table.
 */
const require = createRequire(import.meta.url);

function box(coverage: Uint8Array, width: number, height: number) {
  let [left, right, top, bottom] = [width, -1, height, -1];
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      if (coverage[y * width + x]! < 128) continue;
      left = Math.min(left, x);
      right = Math.max(right, x);
      top = Math.min(top, y);
      bottom = Math.max(bottom, y);
    }
  }
  return { left, right, top, bottom };
}

describe('inscriptions in the engrave file', () => {
  it('centres one line of capitals with its baseline at 93 % of the height, as tall as the font’s cap height', async () => {
    const [width, height] = [1200, 1000];
    // 0.1 of the height: letters set at 100 px.
    const coverage = (await inscriptionCoverage({ lines: ['HELLO'], font: 'rounded', size: 0.1 }, width, height, 'rectangle'))!;
    const font = fontkit.create(readFileSync(require.resolve('@fontsource/nunito/files/nunito-latin-600-normal.woff'))) as fontkit.Font;
    const capHeight = (font.capHeight / font.unitsPerEm) * 100;
    const b = box(coverage, width, height);
    // Baseline at 930 px: capitals sit on it, the O's overshoot reaches a pixel or two below.
    expect(b.bottom + 1).toBeGreaterThanOrEqual(929);
    expect(b.bottom + 1).toBeLessThanOrEqual(933);
    expect(b.bottom - b.top + 1).toBeGreaterThan(capHeight - 3);
    expect(b.bottom - b.top + 1).toBeLessThan(capHeight + 3);
    expect(Math.abs(b.left - (width - 1 - b.right))).toBeLessThanOrEqual(3); // centred, within the side bearings
  });

  it('puts a second line 1.2 letter sizes above the last, and burns every covered pixel', async () => {
    const [width, height] = [800, 600];
    const one = box(
      (await inscriptionCoverage({ lines: ['EVER'], font: 'rounded-bold', size: 0.08 }, width, height, 'rectangle'))!,
      width,
      height,
    );
    const two = box(
      (await inscriptionCoverage({ lines: ['EVER', 'EVER'], font: 'rounded-bold', size: 0.08 }, width, height, 'rectangle'))!,
      width,
      height,
    );
    // 0.08 × 600 = 48 px letters; the line above starts 1.2 × 48 = 57.6 px higher.
    expect(one.top - two.top).toBeGreaterThanOrEqual(57);
    expect(one.top - two.top).toBeLessThanOrEqual(58);
    const coverage = (await inscriptionCoverage({ lines: ['EVER'], font: 'rounded-bold', size: 0.08 }, width, height, 'rectangle'))!;
    const burned = burnInscription({ width, height, data: new Uint8Array(width * height).fill(1) }, coverage);
    const fired = burned.data.reduce((n, v) => n + (v === 0 ? 1 : 0), 0);
    expect(fired).toBe(coverage.reduce((n, c) => n + (c >= 128 ? 1 : 0), 0));
    expect(fired).toBeGreaterThan(1000);
    expect(await inscriptionCoverage(null, width, height, 'rectangle')).toBeNull();
    expect(await inscriptionCoverage({ lines: ['  '], font: 'rounded', size: 0.1 }, width, height, 'rectangle')).toBeNull();
  });
});
