import type { Bitmap, GrayF, Rgba8 } from './image.ts';
import { rgbaToGray, type LumaMode } from './luma.ts';
import { adjustTone, applyLevels, invert, levelsFor, type Levels, type ToneOptions } from './tone.ts';
import { unsharpMask, type UnsharpOptions } from './unsharp.ts';
import { applyMask, cutoutMask, hasCutout, maskFromAlpha, type Mask, type Stroke } from './mask.ts';
import { halftone, type HalftoneOptions } from './halftone/halftone.ts';
import { shapeMask, type BlankShape } from './shape.ts';

/**
 * From a placed photo (already cropped and resampled to the output's pixel size) to the bitmap
 * the laser burns: grayscale → tone → unsharp mask → negative (for materials that mark light) →
 * cut-out with feathered edge → halftone. The negative comes before the cut-out so that outside
 * the subject stays unburned on every material. The cut-out is intersected with the blank's
 * shape fitted to the area (`shape.ts`), so nothing outside the piece is ever burned. Black (0)
 * in the result fires the laser.
 */
export type PrepSettings = {
  luma?: LumaMode;
  autoLevelsClip?: number;
  tone?: ToneOptions;
  sharpen?: UnsharpOptions;
  negative: boolean;
  /** Cut-out: start from the photo's alpha (or everything), then apply strokes, then feather. */
  cutout?: { strokes?: Stroke[]; featherRadius?: number; startMask?: Mask };
  /** The blank's shape, fitted to the whole area; rectangle when absent. */
  shape?: BlankShape;
  halftone: HalftoneOptions;
};

type PrepOnly = Omit<PrepSettings, 'halftone'> & {
  /** Levels computed over the whole photo, when it is prepared in bands. */
  levels?: Levels;
  /** When `photo` is a band of rows of a larger image: where it starts and how tall the whole is. */
  band?: { top: number; fullHeight: number };
};

/**
 * The prepared grayscale (before halftoning), with the coverage mask: also the grayscale master.
 * `mask` is undefined when everything is inside (an opaque photo, no cut-out, a rectangular
 * blank), which spares a full-size mask and its pass over the image.
 */
export type Prepared = { gray: GrayF; mask: Mask | undefined; levels: Levels | undefined };

export function prepareGray(photo: Rgba8, settings: PrepOnly): Prepared {
  let gray = rgbaToGray(photo, settings.luma ?? 'bt709');
  const shape = settings.shape ?? 'rectangle';
  const needsMask = hasCutout(settings.cutout) || shape !== 'rectangle' || !isOpaque(photo);
  if (!needsMask) {
    const levels = settings.levels ?? (settings.autoLevelsClip ? levelsFor(gray, settings.autoLevelsClip) : undefined);
    if (levels) gray = applyLevels(gray, levels);
    return { gray: finishGray(gray, settings), mask: undefined, levels };
  }
  let mask = cutoutMask(settings.cutout?.startMask ?? maskFromAlpha(photo), settings.cutout ?? {});
  // The shape's edge is hard and comes after the feather: the cut-out may soften inside the
  // piece, but nothing may fade out past its edge.
  const band = settings.band ?? { top: 0, fullHeight: photo.height };
  const inShape = shapeMask(shape, photo.width, band.fullHeight, band.top, photo.height);
  if (inShape) {
    if (mask === settings.cutout?.startMask) mask = { ...mask, data: mask.data.slice() };
    for (let i = 0; i < inShape.length; i++) if (!inShape[i]) mask.data[i] = 0;
  }
  const levels = settings.levels ?? (settings.autoLevelsClip ? levelsFor(gray, settings.autoLevelsClip, toOnOff(mask)) : undefined);
  if (levels) gray = applyLevels(gray, levels);
  return { gray: finishGray(gray, settings), mask, levels };
}

/** Tone, sharpening and the negative, in place. */
function finishGray(gray: GrayF, settings: PrepOnly): GrayF {
  if (settings.tone) gray = adjustTone(gray, settings.tone);
  if (settings.sharpen && settings.sharpen.amount > 0) gray = unsharpMask(gray, settings.sharpen, { inPlace: true });
  if (settings.negative) gray = invert(gray);
  return gray;
}

function isOpaque(photo: Rgba8): boolean {
  const data = photo.data;
  for (let p = 3; p < data.length; p += 4) if (data[p] !== 255) return false;
  return true;
}

export function renderBitmap(photo: Rgba8, settings: PrepSettings): Bitmap {
  return renderBurn(photo, settings).bitmap;
}

/** The bitmap with what made it: the coverage mask and the levels (a grayscale master at another resolution reuses both). */
export function renderBurn(photo: Rgba8, settings: PrepSettings): { bitmap: Bitmap; mask: Mask | undefined; levels: Levels | undefined } {
  const { gray, mask, levels } = prepareGray(photo, settings);
  if (!mask) return { bitmap: halftone(gray, settings.halftone), mask, levels };
  const { image, inside } = applyMask(gray, mask);
  return { bitmap: halftone(image, { ...settings.halftone, mask: inside }), mask, levels };
}

function toOnOff(mask: Mask): Uint8Array {
  const out = new Uint8Array(mask.data.length);
  for (let i = 0; i < out.length; i++) out[i] = mask.data[i]! > 0.5 ? 1 : 0;
  return out;
}
