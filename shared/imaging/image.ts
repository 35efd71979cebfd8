/**
 * Image types of the imaging core. Plain typed arrays, row-major, top row first, so the same code
 * runs in the browser's Web Worker and on the server.
 */

/** One channel, 8 bits per pixel (0 = black, 255 = white). */
export type Gray8 = { width: number; height: number; data: Uint8Array };

/** One channel in floating point, code values 0–255 (may go outside while filtering). */
export type GrayF = { width: number; height: number; data: Float32Array };

/** A halftoned result: 1 = white (not burned on a positive), 0 = black; one byte per pixel. */
export type Bitmap = { width: number; height: number; data: Uint8Array };

/** Interleaved 8-bit RGBA, as canvases and sharp's raw output give it. */
export type Rgba8 = { width: number; height: number; data: Uint8Array | Uint8ClampedArray };

export function grayF(width: number, height: number, fill = 0): GrayF {
  return { width, height, data: new Float32Array(width * height).fill(fill) };
}

export function toGrayF(image: Gray8): GrayF {
  return { width: image.width, height: image.height, data: Float32Array.from(image.data) };
}
