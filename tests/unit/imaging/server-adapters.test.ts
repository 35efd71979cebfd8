import { join } from 'node:path';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import sharp, { type Sharp } from 'sharp';
import { AppError } from '#shared/errors.ts';
import { encodeBitmapPng, readPngFacts } from '#server/imaging/png-1bit.ts';
import { GrayAlphaPngWriter } from '#server/imaging/grayscale-master.ts';
import { decodePhoto, inspectPhoto } from '#server/imaging/photo-decode.ts';
import { placePhoto } from '#server/imaging/placement.ts';
import { renderBitmap } from '#shared/imaging/pipeline.ts';
import { pillowOpen, referencePhotoDir } from '#tests/support/pillow.ts';

describe('engrave file and grayscale master (PNG bytes)', () => {
  // PNG specification (ISO/IEC 15948:2004) §11.3.5.3: pixels per metre = round(dpi / 0.0254).
  it.each([
    [254, 10000],
    [300, 11811],
    [360, 14173],
    [600, 23622],
    [1000, 39370],
  ])('writes a true 1-bit gray PNG at %i dpi with pHYs %i, read back by Pillow', (dpi, ppm) => {
    const bitmap = { width: 37, height: 11, data: Uint8Array.from({ length: 37 * 11 }, (_, i) => ((i * 7) % 3 === 0 ? 1 : 0)) };
    const png = encodeBitmapPng(bitmap, dpi);
    const facts = readPngFacts(png);
    expect(facts).toMatchObject({ width: 37, height: 11, bitDepth: 1, colourType: 0, pixelsPerMetre: ppm });
    expect(facts.chunks.indexOf('pHYs')).toBeLessThan(facts.chunks.indexOf('IDAT'));
    const read = pillowOpen(png);
    expect(read.mode).toBe('1');
    expect(read.size).toEqual([37, 11]);
    // Readers round on the way back (300 dpi reads as 299.9994): compare with a tolerance.
    expect(Math.abs(read.dpi[0] - dpi)).toBeLessThan(0.01);
    const stride = Math.ceil(37 / 8);
    for (let y = 0; y < 11; y++)
      for (let x = 0; x < 37; x++) expect((read.bytes[y * stride + (x >> 3)]! >> (7 - (x & 7))) & 1).toBe(bitmap.data[y * 37 + x]);
  });

  it('writes the grayscale master as 8-bit gray with alpha (transparent outside the subject) at 1000 dpi', async () => {
    const alpha = new Uint8Array(200).fill(255);
    alpha.fill(0, 0, 20); // first row outside the subject
    // Written in two bands of rows, as the render writes a large master.
    const writer = new GrayAlphaPngWriter(20, 10, 1000);
    await writer.writeRows(new Uint8Array(60).fill(100), alpha.subarray(0, 60));
    await writer.writeRows(new Uint8Array(140).fill(100), alpha.subarray(60));
    const png = await writer.finish();
    expect(readPngFacts(png)).toMatchObject({ bitDepth: 8, colourType: 4, pixelsPerMetre: 39370 });
    const read = pillowOpen(png);
    expect(read.mode).toBe('LA');
    expect([read.bytes[0], read.bytes[1]]).toEqual([100, 0]);
    expect([read.bytes[2 * 20 * 5], read.bytes[2 * 20 * 5 + 1]]).toEqual([100, 255]);
  });
});

describe('reading buyers’ photos', () => {
  /** A test card of four flat quadrants, so orientation mistakes show. */
  const card = async () => {
    const w = 120;
    const h = 80;
    const data = Buffer.alloc(w * h * 3);
    for (let y = 0; y < h; y++)
      for (let x = 0; x < w; x++) {
        const colour = y < h / 2 ? (x < w / 2 ? [220, 30, 30] : [30, 200, 40]) : x < w / 2 ? [30, 40, 210] : [240, 230, 40];
        data.set(colour, (y * w + x) * 3);
      }
    return { data, w, h };
  };

  // EXIF 2.32 (CIPA DC-008) Orientation: how the stored rows must be turned to show the photo
  // upright. Each file below stores the card turned the other way, so upright is the card again.
  const storedFor: Record<number, (s: Sharp) => Sharp> = {
    1: (s) => s,
    2: (s) => s.flop(),
    3: (s) => s.rotate(180),
    4: (s) => s.flip(),
    // sharp mirrors before it rotates: flip-then-turn is the transpose, flop-then-turn the transverse.
    5: (s) => s.rotate(90).flip(),
    6: (s) => s.rotate(270),
    7: (s) => s.rotate(90).flop(),
    8: (s) => s.rotate(90),
  };

  it.each([1, 2, 3, 4, 5, 6, 7, 8])('shows EXIF orientation %i upright', async (orientation) => {
    const { data, w, h } = await card();
    // Turn first, then tag and encode in a second pipeline.
    const turned = await storedFor[orientation]!(sharp(data, { raw: { width: w, height: h, channels: 3 } }))
      .png()
      .toBuffer();
    const jpeg = await sharp(turned).jpeg({ quality: 95 }).withMetadata({ orientation }).toBuffer();
    const upright = await decodePhoto(jpeg);
    expect([upright.width, upright.height]).toEqual([w, h]);
    expect(await inspectPhoto(jpeg)).toMatchObject({ width: w, height: h, orientation });
    let diff = 0;
    for (let i = 0, p = 0; i < w * h; i++, p += 4)
      diff +=
        Math.abs(upright.data[p]! - data[i * 3]!) +
        Math.abs(upright.data[p + 1]! - data[i * 3 + 1]!) +
        Math.abs(upright.data[p + 2]! - data[i * 3 + 2]!);
    expect(diff / (w * h * 3)).toBeLessThan(6);
  });

  const refuses = async (bytes: Buffer, code: string, message: RegExp) => {
    const error = await inspectPhoto(bytes).then(
      () => undefined,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(AppError);
    expect((error as AppError).code).toBe(code);
    expect((error as AppError).message).toMatch(message);
  };

  it('refuses text, HTML and SVG renamed as photos, with a plain message', async () => {
    await refuses(Buffer.from('just some text, not a photo'), 'UNSUPPORTED_MEDIA_TYPE', /not a photo we can use/);
    await refuses(
      Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'),
      'UNSUPPORTED_MEDIA_TYPE',
      // Only what the upload takes: no TIFF or AVIF offered that would then be refused.
      /^This file is not a photo we can use\. Please send a JPEG, PNG or WebP photo/,
    );
  });

  it('refuses HEIC and says what to do', async () => {
    const heic = Buffer.concat([Buffer.from([0, 0, 0, 24]), Buffer.from('ftypheic'), Buffer.alloc(4), Buffer.from('mif1heic')]);
    await refuses(heic, 'UNSUPPORTED_MEDIA_TYPE', /HEIC.*Most Compatible/);
  });

  it('refuses a PNG that declares 100000 × 100000 pixels before decoding it', async () => {
    const small = await sharp({ create: { width: 8, height: 8, channels: 3, background: '#000000' } })
      .png()
      .toBuffer();
    const bomb = Buffer.from(small);
    bomb.writeUInt32BE(100_000, 16);
    bomb.writeUInt32BE(100_000, 20);
    // Fix the IHDR CRC so the file is well-formed apart from its size claim.
    const { crc32 } = await import('node:zlib');
    bomb.writeUInt32BE(crc32(bomb.subarray(12, 29)) >>> 0, 29);
    await refuses(bomb, 'PAYLOAD_TOO_LARGE', /more pixels than we accept/);
  });

  it('refuses a truncated JPEG as damaged and a thumbnail as too small', async () => {
    const jpeg = await sharp({ create: { width: 200, height: 200, channels: 3, background: '#808080' } })
      .jpeg()
      .toBuffer();
    const error = await decodePhoto(jpeg.subarray(0, Math.floor(jpeg.length / 2))).then(
      () => undefined,
      (e: unknown) => e,
    );
    expect((error as AppError).message).toMatch(/damaged/);
    await refuses(
      await sharp({ create: { width: 40, height: 30, channels: 3, background: '#808080' } })
        .png()
        .toBuffer(),
      'BAD_REQUEST',
      /only 40 × 30 pixels/,
    );
  });

  it('reads CMYK JPEGs and 16-bit PNGs into sRGB', async () => {
    const cmyk = await sharp({ create: { width: 80, height: 80, channels: 3, background: '#c03020' } })
      .toColourspace('cmyk')
      .jpeg()
      .toBuffer();
    const fromCmyk = await decodePhoto(cmyk);
    expect(fromCmyk.data[0]!).toBeGreaterThan(150); // still red after the round trip
    const deep = await sharp({ create: { width: 80, height: 80, channels: 3, background: '#336699' } })
      .toColourspace('rgb16')
      .png()
      .toBuffer();
    expect(readPngFacts(deep).bitDepth).toBe(16);
    expect([...(await decodePhoto(deep)).data.slice(0, 3)]).toEqual([0x33, 0x66, 0x99]);
  });
});

describe('placement and the whole server pipeline', () => {
  it('places a real photo into an 8 × 10 in area at 360 lines per inch: 2880 × 3600 pixels (scikit-image "astronaut", NASA, public domain)', async () => {
    const bytes = readFileSync(join(referencePhotoDir, 'astronaut.png'));
    const placed = await placePhoto(bytes, { crop: { left: 96, top: 0, width: 409, height: 512 } }, { widthMm: 203.2, heightMm: 254 }, 360);
    expect([placed.width, placed.height]).toEqual([2880, 3600]);
    const bitmap = renderBitmap(placed, {
      negative: true,
      sharpen: { amount: 150, radius: 2, threshold: 2 },
      halftone: { method: 'jarvis-judice-ninke' },
    });
    const png = encodeBitmapPng(bitmap, 360);
    expect(readPngFacts(png)).toMatchObject({ width: 2880, height: 3600, bitDepth: 1, colourType: 0, pixelsPerMetre: 14173 });
  });

  it('leaves what the turned photo does not cover transparent, so it never burns', async () => {
    const bytes = readFileSync(join(referencePhotoDir, 'coffee.png'));
    // The whole 600 × 400 photo as the window, turned 15°: its corners fall outside the photo.
    const placed = await placePhoto(
      bytes,
      { crop: { left: 0, top: 0, width: 600, height: 400 }, rotation: 15 },
      { widthMm: 76.2, heightMm: 50.8 },
      100,
    );
    expect([placed.width, placed.height]).toEqual([300, 200]);
    expect(placed.data[3]).toBe(0); // top-left corner alpha
    const centre = (100 * placed.width + 150) * 4;
    expect(placed.data[centre + 3]).toBe(255);
    const bitmap = renderBitmap(placed, { negative: true, halftone: { method: 'floyd-steinberg' } });
    expect(bitmap.data[0]).toBe(1); // the transparent corner stays unburned even as a negative
  });

  it('turns clockwise about the window’s centre and mirrors, as the storefront mock-up draws it', async () => {
    // A grey 200 × 200 photo with a red mark left of centre (at 40–60, 90–110).
    const photo = await sharp({ create: { width: 200, height: 200, channels: 3, background: '#808080' } })
      .composite([
        {
          input: await sharp({ create: { width: 20, height: 20, channels: 3, background: '#ff0000' } })
            .png()
            .toBuffer(),
          left: 40,
          top: 90,
        },
      ])
      .png()
      .toBuffer();
    const area = { widthMm: 50.8, heightMm: 50.8 }; // 200 × 200 at 100 lines per inch
    const red = (img: { width: number; data: ArrayLike<number> }, x: number, y: number) =>
      img.data[(y * img.width + x) * 4]! > 200 && img.data[(y * img.width + x) * 4 + 1]! < 80;
    const window = { left: 0, top: 0, width: 200, height: 200 };
    expect(red(await placePhoto(photo, { crop: window }, area, 100), 50, 100)).toBe(true);
    // Clockwise on screen (y down): a point left of the centre goes above it.
    const turned = await placePhoto(photo, { crop: window, rotation: 90 }, area, 100);
    expect(red(turned, 100, 50)).toBe(true);
    expect(red(turned, 50, 100)).toBe(false);
    // Mirrored: left of centre becomes right of it.
    expect(red(await placePhoto(photo, { crop: window, flipHorizontal: true }, area, 100), 150, 100)).toBe(true);
    // A window reaching past the photo's edge: the part outside is transparent.
    const shifted = await placePhoto(photo, { crop: { left: -100, top: 0, width: 200, height: 200 } }, area, 100);
    expect(shifted.data[(100 * 200 + 10) * 4 + 3]).toBe(0);
    expect(red(shifted, 150, 100)).toBe(true);
  });
});
