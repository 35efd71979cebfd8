import { describe, expect, it } from 'vitest';
import { DIFFUSION_KERNELS, type DiffusionKernelId } from '#shared/imaging/halftone/kernels.ts';
import { errorDiffuse, errorDiffuseAnyKernel } from '#shared/imaging/halftone/error-diffusion.ts';
import { grayF, type GrayF } from '#shared/imaging/image.ts';

/** Rows of each kernel as published, `*` the current pixel (see each source beside the kernel). */
const PUBLISHED: Record<DiffusionKernelId, { divisor: number; rows: string[] }> = {
  'floyd-steinberg': { divisor: 16, rows: ['. * 7', '3 5 1'] }, // Floyd & Steinberg, Proc. SID 17(2), 1976
  'jarvis-judice-ninke': { divisor: 48, rows: ['. . * 7 5', '3 5 7 5 3', '1 3 5 3 1'] }, // Jarvis, Judice, Ninke, CGIP 5(1), 1976
  stucki: { divisor: 42, rows: ['. . * 8 4', '2 4 8 4 2', '1 2 4 2 1'] }, // Stucki, IBM RZ1060, 1981
  burkes: { divisor: 32, rows: ['. . * 8 4', '2 4 8 4 2'] }, // Burkes 1988, in DHALF.TXT
  sierra: { divisor: 32, rows: ['. . * 5 3', '2 4 5 4 2', '. 2 3 2 .'] }, // Sierra 1989, in DHALF.TXT
  'sierra-two-row': { divisor: 16, rows: ['. . * 4 3', '1 2 3 2 1'] }, // Sierra 1990, in DHALF.TXT
  'sierra-lite': { divisor: 4, rows: ['. * 2', '1 1 .'] }, // Sierra 1990, in DHALF.TXT
  atkinson: { divisor: 8, rows: ['. * 1 1', '1 1 1 .', '. 1 . .'] }, // Atkinson; netpbm pamditherbw manual
};

/** Lays a kernel's weights out as published rows, to compare cell by cell. */
function layout(id: DiffusionKernelId): string[] {
  const published = PUBLISHED[id];
  const width = published.rows[0]!.split(' ').length;
  const star = published.rows[0]!.split(' ').indexOf('*');
  const grid: string[][] = published.rows.map((_, y) => Array.from({ length: width }, (_, x) => (y === 0 && x === star ? '*' : '.')));
  for (const [dx, dy, w] of DIFFUSION_KERNELS[id].weights) grid[dy]![star + dx] = String(w);
  return grid.map((row) => row.join(' '));
}

const flat = (value: number, size = 64): GrayF => grayF(size, size, value);
const whiteShare = (bits: Uint8Array) => bits.reduce((n, b) => n + b, 0) / bits.length;

describe('error-diffusion kernels', () => {
  for (const id of Object.keys(PUBLISHED) as DiffusionKernelId[]) {
    it(`${id}: weights and divisor as published`, () => {
      expect(DIFFUSION_KERNELS[id].divisor).toBe(PUBLISHED[id].divisor);
      expect(layout(id)).toEqual(PUBLISHED[id].rows);
    });
  }

  it('all kernels but Atkinson pass on the whole error (weights sum to the divisor)', () => {
    for (const [id, k] of Object.entries(DIFFUSION_KERNELS)) {
      const sum = k.weights.reduce((s, [, , w]) => s + w, 0);
      expect(sum, id).toBe(id === 'atkinson' ? 6 : k.divisor);
    }
  });

  // Mean preservation is the defining property of error diffusion (Floyd & Steinberg 1976;
  // Ulichney 1987): the share of white dots equals the grey level, here within 1 of 255 levels
  // on 256-pixel squares (the error that falls off the right and bottom edges is lost).
  for (const id of Object.keys(PUBLISHED).filter((k) => k !== 'atkinson') as DiffusionKernelId[]) {
    for (const scan of ['raster', 'serpentine'] as const) {
      it(`${id} (${scan}) keeps the mean of flat greys and of a ramp within 1 grey level`, () => {
        for (const v of [16, 64, 100, 128, 180, 230]) {
          const share = whiteShare(errorDiffuse(flat(v, 256), { kernel: id, scan }).data);
          expect(Math.abs(share * 255 - v), `grey ${v}`).toBeLessThanOrEqual(1);
        }
        const ramp = grayF(256, 64);
        for (let y = 0; y < 64; y++) for (let x = 0; x < 256; x++) ramp.data[y * 256 + x] = x;
        const share = whiteShare(errorDiffuse(ramp, { kernel: id, scan }).data);
        expect(Math.abs(share * 255 - 127.5)).toBeLessThanOrEqual(1);
      });
    }
  }

  it('Atkinson loses a quarter of the error by design: shadows clip (flat 64 comes out near 45)', () => {
    const share = whiteShare(errorDiffuse(flat(64, 128), { kernel: 'atkinson' }).data) * 255;
    expect(share).toBeGreaterThan(35);
    expect(share).toBeLessThan(55);
  });

  it('leaves masked pixels white and keeps them out of the diffusion', () => {
    const image = flat(40, 128);
    const mask = new Uint8Array(128 * 128).fill(1);
    mask.fill(0, 0, 64 * 128); // top half outside the subject
    const bits = errorDiffuse(image, { kernel: 'jarvis-judice-ninke', mask }).data;
    expect([...bits.slice(0, 64 * 128)].every((b) => b === 1)).toBe(true);
    expect(Math.abs(whiteShare(bits.slice(64 * 128)) * 255 - 40)).toBeLessThanOrEqual(2);
  });
});

describe('the Jarvis–Judice–Ninke loop of its own', () => {
  // Our own check, no outside source: the faster loop must give exactly what the general one does.
  const image = grayF(301, 97);
  for (let i = 0; i < image.data.length; i++) image.data[i] = ((i % 301) / 300) * 255 * 0.7 + ((i * 7919) % 97);
  const mask = new Uint8Array(image.data.length).map((_, i) => (i % 301 > 40 && i % 301 < 260 ? 1 : 0));
  it.each([
    ['raster', undefined],
    ['serpentine', undefined],
    ['serpentine', mask],
  ] as const)('matches the general loop bit for bit (%s, masked: %s)', (scan, withMask) => {
    const options = { kernel: 'jarvis-judice-ninke' as const, scan, mask: withMask };
    expect(errorDiffuse(image, options).data).toEqual(errorDiffuseAnyKernel(image, options).data);
  });
});
