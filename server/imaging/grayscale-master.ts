import { once } from 'node:events';
import { createDeflate, type Deflate } from 'node:zlib';
import { ihdrChunk, pHYsChunk, PNG_SIGNATURE, pngChunk } from './png-1bit.ts';

/**
 * The grayscale master for studios that halftone in their own machine software: 8-bit gray with
 * the coverage as alpha (transparent outside the subject and the blank's shape), its resolution
 * in pHYs (PNG specification, §11.3.5.3). Written row by row, so a large master never exists
 * whole in memory as raw pixels: each band's rows are filtered and fed to one deflate stream, and
 * only the compressed file is kept. Written here rather than by sharp, which needs the whole
 * image as one buffer. Rows use the PNG "Up" filter (§9.2, type 2), which suits photographs and
 * costs one subtraction per byte.
 */
export class GrayAlphaPngWriter {
  private readonly deflate: Deflate;
  private readonly compressed: Buffer[] = [];
  /** The row above, unfiltered (zero above the first row), and room for the current one. */
  private previous: Buffer;
  private current: Buffer;
  private rowsWritten = 0;
  private draining: Promise<void> | undefined;

  constructor(
    readonly width: number,
    readonly height: number,
    readonly dpi: number,
    level = 6,
  ) {
    this.deflate = createDeflate({ level, chunkSize: 1 << 20 });
    this.deflate.on('data', (chunk: Buffer) => this.compressed.push(chunk));
    this.previous = Buffer.alloc(width * 2);
    this.current = Buffer.alloc(width * 2);
  }

  /** Adds the next `gray.length / width` rows (gray and alpha side by side, 0–255). */
  async writeRows(gray: Uint8Array, alpha: Uint8Array): Promise<void> {
    const { width } = this;
    const rows = gray.length / width;
    if (this.rowsWritten + rows > this.height) throw new RangeError('more rows than the image has');
    const stride = width * 2;
    const out = Buffer.alloc(rows * (stride + 1));
    let [previous, current] = [this.previous, this.current];
    for (let y = 0; y < rows; y++) {
      for (let x = 0; x < width; x++) {
        current[2 * x] = gray[y * width + x]!;
        current[2 * x + 1] = alpha[y * width + x]!;
      }
      const start = y * (stride + 1);
      out[start] = 2; // Up: each byte minus the byte above it
      for (let i = 0; i < stride; i++) out[start + 1 + i] = (current[i]! - previous[i]!) & 0xff;
      [previous, current] = [current, previous];
    }
    [this.previous, this.current] = [previous, current];
    this.rowsWritten += rows;
    // Deflate runs on libuv's thread pool: the next band is prepared while this one compresses,
    // and only one band's rows wait in its queue at a time.
    await this.draining;
    this.draining = this.deflate.write(out) ? undefined : once(this.deflate, 'drain').then(() => undefined);
  }

  /** The finished PNG. */
  async finish(): Promise<Buffer> {
    if (this.rowsWritten !== this.height) throw new RangeError(`${this.rowsWritten} of ${this.height} rows written`);
    await this.draining;
    const ended = once(this.deflate, 'end');
    this.deflate.end();
    await ended;
    const idat = Buffer.concat(this.compressed);
    this.compressed.length = 0;
    // IDAT chunks of at most 8 MiB each (a chunk's length is a 31-bit number; smaller chunks
    // keep a reader's buffers modest).
    const chunks: Buffer[] = [];
    for (let o = 0; o < idat.length; o += 8 << 20) chunks.push(pngChunk('IDAT', idat.subarray(o, o + (8 << 20))));
    if (!chunks.length) chunks.push(pngChunk('IDAT', idat));
    return Buffer.concat([
      PNG_SIGNATURE,
      ihdrChunk(this.width, this.height, 8, 4),
      pHYsChunk(this.dpi),
      ...chunks,
      pngChunk('IEND', Buffer.alloc(0)),
    ]);
  }
}
