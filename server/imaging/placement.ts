import { availableParallelism } from 'node:os';
import sharp, { type Sharp } from 'sharp';
import type { Rgba8 } from '#shared/imaging/image.ts';
import { outputSize } from '#shared/imaging/sizing.ts';
import { MAX_INPUT_PIXELS } from './photo-decode.ts';

/**
 * Where the photo sits in the engraving area, as `shared/schemas/checkout.ts` defines it and the
 * storefront's mock-up draws it: a window of the area's proportions over the upright photo (it
 * may reach past the photo's edges, which stay transparent and so never burn); the photo mirrored
 * if asked and turned by `rotation` degrees clockwise about the window's centre. The window then
 * fills the area at the line density, resampled with Lanczos-3.
 */
// libvips picks one thread on a two-core machine; rendering wants them all.
sharp.concurrency(availableParallelism());

export type Placement = {
  crop: { left: number; top: number; width: number; height: number };
  rotation?: number;
  flipHorizontal?: boolean;
};

const CLEAR = { r: 255, g: 255, b: 255, alpha: 0 };

/** Runs a pipeline to raw pixels and opens them as the next stage's input. */
async function rawStage(pipeline: Sharp): Promise<Sharp> {
  const { data, info } = await pipeline.raw().toBuffer({ resolveWithObject: true });
  return sharp(data, { raw: { width: info.width, height: info.height, channels: info.channels }, limitInputPixels: false });
}

/**
 * A region of the upright photo, padded with transparency where it reaches past the edges, as
 * raw RGBA pixels.
 */
async function region(
  upright: { data: Buffer; width: number; height: number },
  left: number,
  top: number,
  width: number,
  height: number,
): Promise<Sharp> {
  const pad = {
    left: Math.max(0, -left),
    top: Math.max(0, -top),
    right: Math.max(0, left + width - upright.width),
    bottom: Math.max(0, top + height - upright.height),
  };
  let pipeline = sharp(upright.data, { raw: { width: upright.width, height: upright.height, channels: 4 }, limitInputPixels: false });
  if (pad.left || pad.top || pad.right || pad.bottom) pipeline = await rawStage(pipeline.extend({ ...pad, background: CLEAR }));
  return rawStage(pipeline.extract({ left: left + pad.left, top: top + pad.top, width, height }));
}

/**
 * The window of the upright photo that fills the area, at the photo's own resolution, as raw
 * RGBA pixels: cut, mirrored and turned, not yet resampled to the line density.
 */
async function placedWindow(bytes: Buffer, placement: Placement): Promise<Sharp> {
  const { crop } = placement;
  const [w, h] = [Math.max(1, Math.round(crop.width)), Math.max(1, Math.round(crop.height))];
  const [cx, cy] = [crop.left + crop.width / 2, crop.top + crop.height / 2];
  const decoded = () => sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS }).rotate().toColourspace('srgb').ensureAlpha();
  const [left, top] = [Math.round(cx - w / 2), Math.round(cy - h / 2)];
  const turn = (((placement.rotation ?? 0) % 360) + 360) % 360;
  // Stages hand over raw pixels: encoding them in between would be work for nothing.
  if (!turn && left >= 0 && top >= 0) {
    // The common case, a window inside the photo: cut it while decoding (sharp applies one
    // geometry step per pipeline, so the upright turn and the cut come first, alone).
    const meta = await sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS }).metadata();
    const [uw, uh] = (meta.orientation ?? 1) >= 5 ? [meta.height ?? 0, meta.width ?? 0] : [meta.width ?? 0, meta.height ?? 0];
    if (left + w <= uw && top + h <= uh) {
      const window = await rawStage(decoded().extract({ left, top, width: w, height: h }));
      return placement.flipHorizontal ? rawStage(window.flop()) : window;
    }
  }
  const { data: uprightData, info } = await decoded().raw().toBuffer({ resolveWithObject: true });
  const upright = { data: uprightData, width: info.width, height: info.height };
  if (turn % 90 === 0) {
    // No turn or quarter turns are exact: the whole photo is mirrored and turned without
    // resampling, the window's centre follows, and the window is cut around it as for no turn.
    let photo = sharp(upright.data, { raw: { width: upright.width, height: upright.height, channels: 4 }, limitInputPixels: false });
    let [x, y, pw, ph] = [cx, cy, upright.width, upright.height];
    if (placement.flipHorizontal) {
      photo = await rawStage(photo.flop());
      x = pw - x;
    }
    if (turn) {
      photo = await rawStage(photo.rotate(turn));
      // Clockwise: 90° takes (x, y) to (H − y, x); 180° to (W − x, H − y); 270° to (y, W − x).
      [x, y] = turn === 90 ? [ph - y, x] : turn === 180 ? [pw - x, ph - y] : [y, pw - x];
      if (turn !== 180) [pw, ph] = [ph, pw];
    }
    const { data } = await photo.raw().toBuffer({ resolveWithObject: true });
    return region({ data, width: pw, height: ph }, Math.round(x - w / 2), Math.round(y - h / 2), w, h);
  }
  // A square around the window's centre large enough for any turn, mirrored, turned about its
  // centre (the corners it opens are transparent), then the window cut from its middle.
  const side = Math.ceil(Math.hypot(w, h)) + 2;
  let turned = await region(upright, Math.round(cx - side / 2), Math.round(cy - side / 2), side, side);
  if (placement.flipHorizontal) turned = await rawStage(turned.flop());
  const { data: rotated, info: r } = await turned.rotate(turn, { background: CLEAR }).raw().toBuffer({ resolveWithObject: true });
  return region({ data: rotated, width: r.width, height: r.height }, Math.round((r.width - w) / 2), Math.round((r.height - h) / 2), w, h);
}

/** The window's raw RGBA pixels, decoded once and kept when a piece is resampled more than once. */
export type WindowPixels = { data: Buffer; width: number; height: number };

export async function windowPixels(bytes: Buffer, placement: Placement): Promise<WindowPixels> {
  const { data, info } = await (await placedWindow(bytes, placement)).raw().toBuffer({ resolveWithObject: true });
  return { data, width: info.width, height: info.height };
}

/** The window resampled to fill `size` with Lanczos-3 (a libvips pipeline of its own). */
const resampled = (window: WindowPixels, size: { width: number; height: number }) =>
  sharp(window.data, { raw: { width: window.width, height: window.height, channels: 4 }, limitInputPixels: false }).resize({
    width: size.width,
    height: size.height,
    fit: 'fill',
    kernel: 'lanczos3',
  });

const asRgba8 = (data: Buffer, width: number, height: number): Rgba8 => ({
  width,
  height,
  data: new Uint8Array(data.buffer, data.byteOffset, data.length),
});

/** The placed photo at the output's pixel size. */
export async function placeWindow(window: WindowPixels, size: { width: number; height: number }): Promise<Rgba8> {
  const { data, info } = await resampled(window, size).raw().toBuffer({ resolveWithObject: true });
  return asRgba8(data, info.width, info.height);
}

export async function placePhoto(
  bytes: Buffer,
  placement: Placement,
  area: { widthMm: number; heightMm: number },
  linesPerInch: number,
): Promise<Rgba8> {
  return placeWindow(await windowPixels(bytes, placement), outputSize(area, linesPerInch));
}

/**
 * The same placed photo in bands of rows, for outputs too large to hold whole (an 8 × 10 in
 * master at 1000 ppi is 80 megapixels, 320 MB as RGBA): libvips, which computes only the rows
 * asked for, resamples each band from the window. Bands overlap by `overlap` rows on each side,
 * so neighbourhood steps (sharpening) see their neighbours.
 */
export async function* placeWindowInBands(
  window: WindowPixels,
  size: { width: number; height: number },
  bandRows: number,
  overlap: number,
): AsyncGenerator<{ top: number; from: number; pixels: Rgba8 }> {
  const band = (top: number) => {
    const from = Math.max(0, top - overlap);
    const rows = Math.min(size.height, top + bandRows + overlap) - from;
    return { from, pixels: resampled(window, size).extract({ left: 0, top: from, width: size.width, height: rows }).raw().toBuffer() };
  };
  // libvips resamples the next band on its own threads while the caller works on this one.
  let next = band(0);
  for (let top = 0; top < size.height; top += bandRows) {
    const current = next;
    if (top + bandRows < size.height) next = band(top + bandRows);
    const data = await current.pixels;
    yield { top, from: current.from, pixels: asRgba8(data, size.width, data.length / 4 / size.width) };
  }
}
