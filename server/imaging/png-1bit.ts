import { crc32, deflateSync } from 'node:zlib';
import type { Bitmap } from '#shared/imaging/image.ts';

/**
 * The engrave file: a true 1-bit grayscale PNG (IHDR bit depth 1, colour type 0) with its
 * physical resolution in pHYs, per the PNG specification (W3C / ISO/IEC 15948:2004, §11.2.2 and
 * §11.3.5.3: pixels per metre = round(dpi / 0.0254), unit byte 1 = metre, before the first IDAT).
 * Written here rather than by sharp, which saves 1-bit PNGs only as palette images.
 * In the file, 0 is black (the laser fires) and 1 is white.
 */
export function pngChunk(type: string, data: Buffer): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, 'latin1');
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])) >>> 0, 0);
  return Buffer.concat([head, data, crc]);
}

export const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);

/** IHDR: size, bit depth and colour type; deflate, adaptive filtering, no interlace. */
export function ihdrChunk(width: number, height: number, bitDepth: number, colourType: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = bitDepth;
  ihdr[9] = colourType;
  return pngChunk('IHDR', ihdr);
}

export const pixelsPerMetre = (dpi: number) => Math.round(dpi / 0.0254);

export function pHYsChunk(dpi: number): Buffer {
  const data = Buffer.alloc(9);
  data.writeUInt32BE(pixelsPerMetre(dpi), 0);
  data.writeUInt32BE(pixelsPerMetre(dpi), 4);
  data[8] = 1; // unit: metre
  return pngChunk('pHYs', data);
}

export function encodeBitmapPng(bitmap: Bitmap, dpi: number): Buffer {
  const { width, height, data } = bitmap;
  const stride = Math.ceil(width / 8);
  const raw = Buffer.alloc((stride + 1) * height); // each row: filter byte 0, then packed bits
  for (let y = 0; y < height; y++) {
    const row = y * (stride + 1) + 1;
    for (let x = 0; x < width; x++) if (data[y * width + x]) raw[row + (x >> 3)]! |= 0x80 >> (x & 7);
  }
  return Buffer.concat([
    PNG_SIGNATURE,
    ihdrChunk(width, height, 1, 0), // 1 bit, grayscale
    pHYsChunk(dpi),
    pngChunk('IDAT', deflateSync(raw, { level: 6 })),
    pngChunk('IEND', Buffer.alloc(0)),
  ]);
}

/** Reads the header facts a test or an upload check needs: size, bit depth, colour type, dpi. */
export function readPngFacts(png: Buffer): {
  width: number;
  height: number;
  bitDepth: number;
  colourType: number;
  pixelsPerMetre?: number;
  chunks: string[];
} {
  if (png.readUInt32BE(0) !== 0x89504e47) throw new Error('not a PNG');
  const chunks: string[] = [];
  let ppm: number | undefined;
  for (let o = 8; o < png.length;) {
    const length = png.readUInt32BE(o);
    const type = png.toString('latin1', o + 4, o + 8);
    chunks.push(type);
    if (type === 'pHYs' && png[o + 16] === 1) ppm = png.readUInt32BE(o + 8);
    o += 12 + length;
  }
  return {
    width: png.readUInt32BE(16),
    height: png.readUInt32BE(20),
    bitDepth: png[24]!,
    colourType: png[25]!,
    pixelsPerMetre: ppm,
    chunks,
  };
}
