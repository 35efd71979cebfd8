import { availableParallelism } from 'node:os';
import sharp, { type Sharp } from 'sharp';
import type { Rgba8 } from '../../shared/imaging/image.ts';
import { outputSize } from '../../shared/imaging/sizing.ts';
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
async function region(upright: { data: Buffer; width: number; height: number }, left: number, top: number, width: number, height: number): Promise<Sharp> {
  const pad = { left: Math.max(0, -left), top: Math.max(0, -top), right: Math.max(0, left + width - upright.width), bottom: Math.max(0, top + height - upright.height) };
  let pipeline = sharp(upright.data, { raw: { width: upright.width, height: upright.height, channels: 4 }, limitInputPixels: false });
  if (pad.left || pad.top || pad.right || pad.bottom) pipeline = await rawStage(pipeline.extend({ ...pad, background: CLEAR }));
  return rawStage(pipeline.extract({ left: left + pad.left, top: top + pad.top, width, height }));
}

/**
 * The window of the upright photo that fills the area, at the photo's own resolution, as raw
 * RGBA pixels: cut, mirrored and turned, not yet resampled to the line density.
 */
export async function placedWindow(bytes: Buffer, placement: Placement): Promise<Sharp> {
  const { crop } = placement;
  const [w, h] = [Math.max(1, Math.round(crop.width)), Math.max(1, Math.round(crop.height))];
  const [cx, cy] = [crop.left + crop.width / 2, crop.top + crop.height / 2];
  const decoded = () => sharp(bytes, { limitInputPixels: MAX_INPUT_PIXELS }).rotate().toColourspace('srgb').ensureAlpha();
  const [left, top] = [Math.round(cx - w / 2), Math.round(cy - h / 2)];
  const turn = ((((placement.rotation ?? 0) % 360) + 360) % 360);
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

/** The placed photo at the output's pixel size: the window resampled with Lanczos-3. */
export async function placePhoto(bytes: Buffer, placement: Placement, area: { widthMm: number; heightMm: number }, linesPerInch: number): Promise<Rgba8> {
  return finish(await placedWindow(bytes, placement), outputSize(area, linesPerInch));
}

/**
 * The same placed photo in bands of rows, for outputs too large to hold whole (an 8 × 10 in
 * master at 1000 ppi is 80 megapixels, 320 MB as RGBA): the window is decoded once, and libvips,
 * which computes only the rows asked for, resamples each band. Bands overlap by `overlap` rows
 * on each side, so neighbourhood steps (sharpening) see their neighbours.
 */
export async function* placePhotoInBands(bytes: Buffer, placement: Placement, size: { width: number; height: number }, bandRows: number, overlap: number): AsyncGenerator<{ top: number; from: number; pixels: Rgba8 }> {
  const { data, info } = await (await placedWindow(bytes, placement)).raw().toBuffer({ resolveWithObject: true });
  const band = (top: number) => {
    const from = Math.max(0, top - overlap);
    const to = Math.min(size.height, top + bandRows + overlap);
    const rows = sharp(data, { raw: { width: info.width, height: info.height, channels: 4 }, limitInputPixels: false })
      .resize({ width: size.width, height: size.height, fit: 'fill', kernel: 'lanczos3' })
      .extract({ left: 0, top: from, width: size.width, height: to - from })
      .raw()
      .toBuffer();
    return { top, from, rows };
  };
  // libvips resamples the next band on its own threads while the caller works on this one.
  let next = band(0);
  while (next.top < size.height) {
    const current = next;
    if (current.top + bandRows < size.height) next = band(current.top + bandRows);
    else next = { top: size.height, from: 0, rows: Promise.resolve(Buffer.alloc(0)) };
    const rows = await current.rows;
    yield { top: current.top, from: current.from, pixels: { width: size.width, height: rows.length / 4 / size.width, data: new Uint8Array(rows.buffer, rows.byteOffset, rows.length) } };
  }
}

async function finish(window: Sharp, size: { width: number; height: number }): Promise<Rgba8> {
  const { data, info } = await window.resize({ width: size.width, height: size.height, fit: 'fill', kernel: 'lanczos3' }).ensureAlpha().raw().toBuffer({ resolveWithObject: true });
  return { width: info.width, height: info.height, data: new Uint8Array(data.buffer, data.byteOffset, data.length) };
}
