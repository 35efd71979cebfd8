import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { floydSteinbergPillow } from '#shared/imaging/halftone/error-diffusion.ts';
import { unsharpMask, applyUnsharp } from '#shared/imaging/unsharp.ts';
import { toGrayF } from '#shared/imaging/image.ts';
import { pillowReadGray, referencePhotoDir, runPillow, unpackBits } from '#tests/support/pillow.ts';

// Reference: Debian's Pillow (python3-pil). Image.convert('1') is Floyd–Steinberg in raster
// order with integer error terms, truncation toward zero, clamping and a > 128 threshold
// (Pillow source, libImaging/Convert.c); our reference mode follows the same rules.
const gray = (width: number, height: number, at: (x: number, y: number) => number) => {
  const data = new Uint8Array(width * height);
  for (let y = 0; y < height; y++) for (let x = 0; x < width; x++) data[y * width + x] = at(x, y);
  return { width, height, data };
};

describe("Floyd–Steinberg against Pillow's convert('1'), bit for bit", () => {
  const cases = {
    'a horizontal ramp': gray(256, 40, (x) => x),
    'a diagonal ramp': gray(123, 77, (x, y) => Math.round(((x + y) / 198) * 255)),
    'flat greys': gray(90, 90, (x, y) => [0, 1, 64, 127, 128, 129, 200, 254, 255][Math.floor((y * 9) / 90)]! + 0 * x),
  };
  for (const [name, image] of Object.entries(cases)) {
    it(`on ${name}`, () => {
      const ours = floydSteinbergPillow(image).data;
      const theirs = unpackBits(runPillow("out = img.convert('1')", image), image.width, image.height);
      expect(Buffer.from(ours).equals(Buffer.from(theirs))).toBe(true);
    });
  }

  // camera.png from scikit-image's data (CC0), via Debian's python3-skimage.
  it('on a real photograph (scikit-image "camera", CC0)', () => {
    const photo = pillowReadGray(join(referencePhotoDir, 'camera.png'));
    expect([photo.width, photo.height]).toEqual([512, 512]);
    const ours = floydSteinbergPillow(photo).data;
    const theirs = unpackBits(runPillow("out = img.convert('1')", photo), photo.width, photo.height);
    const differing = ours.reduce((n, b, i) => n + (b === theirs[i] ? 0 : 1), 0);
    expect(differing).toBe(0);
  });
});

describe('unsharp mask', () => {
  it('follows g = f + k·(f − blur) on a hand-worked example, unchanged under the threshold', () => {
    // Gonzalez & Woods, Digital Image Processing, 3rd ed., §3.6.3; worked by hand:
    // f = 10, 50, 90, 120; blur = 30, 50, 70, 110; k = 1.5 →
    // 10 + 1.5·(−20) = −20 → 0 (clamped); 50; 90 + 1.5·20 = 120; 120 + 1.5·10 = 135.
    const f = { width: 4, height: 1, data: Float32Array.from([10, 50, 90, 120]) };
    const blurred = { width: 4, height: 1, data: Float32Array.from([30, 50, 70, 110]) };
    expect([...applyUnsharp(f, blurred, 150, 0).data]).toEqual([0, 50, 120, 135]);
    // With threshold 15, only differences of 15 or more are sharpened: the last pixel (10) is kept.
    expect([...applyUnsharp(f, blurred, 150, 15).data]).toEqual([0, 50, 120, 120]);
  });

  it("agrees with Pillow's ImageFilter.UnsharpMask on a real photograph within a stated tolerance", () => {
    // Pillow blurs with three box passes approximating the Gaussian, we with the Gaussian itself,
    // so the two differ a little on the sharpest edges. Tolerance set from a measured run
    // (mean under 2 code values, worst 15 on this photograph): under 2 on average, 16 at worst.
    const photo = pillowReadGray(join(referencePhotoDir, 'camera.png'));
    const theirs = runPillow('out = img.filter(ImageFilter.UnsharpMask(radius=2, percent=150, threshold=3))', photo);
    const ours = unsharpMask(toGrayF(photo), { amount: 150, radius: 2, threshold: 3 }).data;
    let total = 0;
    let worst = 0;
    for (let i = 0; i < ours.length; i++) {
      const d = Math.abs(Math.round(ours[i]!) - theirs[i]!);
      total += d;
      worst = Math.max(worst, d);
    }
    expect(total / ours.length).toBeLessThan(2);
    expect(worst).toBeLessThanOrEqual(16);
  });
});
