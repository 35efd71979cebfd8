import type { Bitmap } from './image.ts';
import { insideShape, type BlankShape } from './shape.ts';

/**
 * The mock-up: the halftoned result drawn in the material's colours inside the blank's shape.
 * A bitmap pixel that fires the laser (0) shows the mark colour, every other pixel the surface;
 * outside the shape is transparent. The bitmap is the engrave file's own, so what the buyer sees
 * is what will burn.
 */
export type MockupInput = {
  bitmap: Bitmap;
  shape: BlankShape;
  /** `#rrggbb`. */
  surfaceColour: string;
  markColour: string;
};

function hex(colour: string): [number, number, number] {
  const m = /^#([0-9a-f]{2})([0-9a-f]{2})([0-9a-f]{2})$/i.exec(colour);
  if (!m) throw new RangeError(`not a #rrggbb colour: ${colour}`);
  return [parseInt(m[1]!, 16), parseInt(m[2]!, 16), parseInt(m[3]!, 16)];
}

export function renderMockup(input: MockupInput): { width: number; height: number; data: Uint8ClampedArray } {
  const { bitmap, shape } = input;
  const [sr, sg, sb] = hex(input.surfaceColour);
  const [mr, mg, mb] = hex(input.markColour);
  const { width, height } = bitmap;
  const out = new Uint8ClampedArray(width * height * 4);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const i = y * width + x;
      const p = i * 4;
      if (!insideShape(shape, x, y, width, height)) continue; // transparent
      const mark = bitmap.data[i] === 0;
      out[p] = mark ? mr : sr;
      out[p + 1] = mark ? mg : sg;
      out[p + 2] = mark ? mb : sb;
      out[p + 3] = 255;
    }
  }
  return { width, height, data: out };
}
