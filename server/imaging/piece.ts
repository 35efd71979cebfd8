import type { Bitmap, Rgba8 } from '#shared/imaging/image.ts';
import { cutoutMask, fullMask, hasCutout, type Mask } from '#shared/imaging/mask.ts';
import { prepareGray, renderBurn, type PrepSettings as PipelineSettings } from '#shared/imaging/pipeline.ts';
import type { BlankShape } from '#shared/imaging/shape.ts';
import { outputSize } from '#shared/imaging/sizing.ts';
import type { Levels } from '#shared/imaging/tone.ts';
import { gradeSettings, pipelineSettings, prepAtWidth } from '#shared/orders/prep-pipeline.ts';
import type { Inscription } from '#shared/schemas/checkout.ts';
import type { PrepSettings } from '#shared/schemas/prep.ts';
import { GrayAlphaPngWriter } from './grayscale-master.ts';
import { burnInscription, inscribeMaster, inscriptionCoverage } from './inscription.ts';
import { placeWindow, placeWindowInBands, windowPixels, type Placement, type WindowPixels } from './placement.ts';

/**
 * One piece as it burns, from the original photo: the one pipeline behind every picture of it
 * (the proof, the 1:1 region, the engrave file and the grayscale master; the storefront's
 * mock-up runs the same shared steps in the browser). The photo is placed in the engraving area
 * at a resolution, prepared (tone, sharpening, negative, cut-out within the blank's shape),
 * halftoned and lettered (the letters cut to the shape too), so nothing outside the piece fires.
 */
export type Piece = {
  placement: Placement;
  /** The engraving area, turned as the buyer chose. */
  area: { widthMm: number; heightMm: number };
  shape: BlankShape;
  inscription: Inscription | null;
};

/** A burned piece with what a master at another resolution reuses: the decoded window, the settings and the levels. */
export type Burned = { window: WindowPixels; placed: Rgba8; settings: PipelineSettings; bitmap: Bitmap; levels: Levels | undefined };

/** The piece halftoned at `prep.linesPerInch`. */
export async function burnPiece(photo: Buffer, piece: Piece, prep: PrepSettings): Promise<Burned> {
  const window = await windowPixels(photo, piece.placement);
  const placed = await placeWindow(window, outputSize(piece.area, prep.linesPerInch));
  const settings = pipelineSettings(prep, placed, piece.shape);
  const { bitmap, levels } = renderBurn(placed, settings);
  burnInscription(bitmap, await inscriptionCoverage(piece.inscription, placed.width, placed.height, piece.shape));
  return { window, placed, settings, bitmap, levels };
}

/** Rows per band of the master: about 8000 × 512 pixels, some 80 MB of working copies. */
const MASTER_BAND_ROWS = 512;

/**
 * The grayscale master at `ppi`, written in bands from placement to PNG. It is the engrave
 * file's own preparation at another resolution: the same levels (measured once, at the burn's
 * resolution), the sharpening and feather scaled to its pixels, the cut-out made at the burn's
 * resolution and sampled up (a flood fill cannot run band by band), and the shape, the photo's
 * own edges and the lettering drawn exactly at the master's resolution.
 */
export async function writePieceMaster(
  piece: Piece,
  prep: PrepSettings,
  burned: Burned,
  ppi: number,
): Promise<{ png: Buffer; width: number; height: number }> {
  const size = outputSize(piece.area, ppi);
  const scaled = prepAtWidth(prep, piece.area.widthMm, size.width);
  const grade = gradeSettings(scaled, piece.shape);
  const cutout = cutoutAtBurn(burned.settings, burned.placed);
  const overlap = Math.ceil(3 * scaled.sharpenRadius) + 4;
  const writer = new GrayAlphaPngWriter(size.width, size.height, ppi);
  for await (const { top, from, pixels } of placeWindowInBands(burned.window, size, MASTER_BAND_ROWS, overlap)) {
    const startMask = cutout && sampleCutout(cutout, pixels, from, size);
    const prepared = prepareGray(pixels, {
      ...grade,
      autoLevelsClip: undefined,
      levels: burned.levels,
      cutout: startMask && { startMask },
      band: { top: from, fullHeight: size.height },
    });
    const rows = Math.min(MASTER_BAND_ROWS, size.height - top);
    const keepFrom = (top - from) * size.width;
    const gray = new Uint8Array(rows * size.width);
    const alpha = new Uint8Array(rows * size.width);
    for (let i = 0; i < gray.length; i++) {
      const v = Math.round(prepared.gray.data[keepFrom + i]!);
      gray[i] = v < 0 ? 0 : v > 255 ? 255 : v;
      const c = prepared.mask ? prepared.mask.data[keepFrom + i]! : 1;
      alpha[i] = Math.round((c < 0 ? 0 : c > 1 ? 1 : c) * 255);
    }
    inscribeMaster({ gray, alpha }, await inscriptionCoverage(piece.inscription, size.width, size.height, piece.shape, { top, rows }));
    await writer.writeRows(gray, alpha);
  }
  return { png: await writer.finish(), ...size };
}

/** The cut-out alone (its start, strokes and feather) at the burn's resolution, or undefined when there is none. */
function cutoutAtBurn(settings: PipelineSettings, placed: Rgba8): Mask | undefined {
  const { cutout } = settings;
  // The photo's own alpha is left out: it is taken at the master's resolution, band by band.
  return cutout && hasCutout(cutout) ? cutoutMask(cutout.startMask ?? fullMask(placed.width, placed.height), cutout) : undefined;
}

/** The cut-out sampled (bilinear) at a band's pixel centres, within the band's own coverage (its alpha). */
function sampleCutout(cutout: Mask, band: Rgba8, from: number, size: { width: number; height: number }): Mask {
  const out = new Float32Array(band.width * band.height);
  const [sx, sy] = [cutout.width / size.width, cutout.height / size.height];
  for (let y = 0; y < band.height; y++) {
    const v = Math.min(Math.max((from + y + 0.5) * sy - 0.5, 0), cutout.height - 1);
    const y0 = Math.floor(v);
    const y1 = Math.min(y0 + 1, cutout.height - 1);
    const fy = v - y0;
    for (let x = 0; x < band.width; x++) {
      const u = Math.min(Math.max((x + 0.5) * sx - 0.5, 0), cutout.width - 1);
      const x0 = Math.floor(u);
      const x1 = Math.min(x0 + 1, cutout.width - 1);
      const fx = u - x0;
      const top = cutout.data[y0 * cutout.width + x0]! * (1 - fx) + cutout.data[y0 * cutout.width + x1]! * fx;
      const bottom = cutout.data[y1 * cutout.width + x0]! * (1 - fx) + cutout.data[y1 * cutout.width + x1]! * fx;
      const i = y * band.width + x;
      out[i] = Math.min(top * (1 - fy) + bottom * fy, band.data[i * 4 + 3]! / 255);
    }
  }
  return { width: band.width, height: band.height, data: out };
}
