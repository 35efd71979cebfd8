import type { Bitmap, GrayF, Rgba8 } from './image.ts';
import { rgbaToGray, type LumaMode } from './luma.ts';
import { adjustTone, applyLevels, invert, levelsFor, type Levels, type ToneOptions } from './tone.ts';
import { unsharpMask, type UnsharpOptions } from './unsharp.ts';
import { applyMask, featherMask, maskFromAlpha, paintStrokes, type Mask, type Stroke } from './mask.ts';
import { halftone, type HalftoneOptions } from './halftone/halftone.ts';

/**
 * From a placed photo (already cropped and resampled to the output's pixel size) to the bitmap
 * the laser burns: grayscale → tone → unsharp mask → negative (for materials that mark light) →
 * cut-out with feathered edge → halftone. The negative comes before the cut-out so that outside
 * the subject stays unburned on every material. Black (0) in the result fires the laser.
 */
export type PrepSettings = {
  luma?: LumaMode;
  autoLevelsClip?: number;
  tone?: ToneOptions;
  sharpen?: UnsharpOptions;
  negative: boolean;
  /** Cut-out: start from the photo's alpha (or everything), then apply strokes, then feather. */
  cutout?: { strokes?: Stroke[]; featherRadius?: number; startMask?: Mask };
  halftone: HalftoneOptions;
};

type PrepOnly = Omit<PrepSettings, 'halftone'> & {
  /** Levels computed over the whole photo, when it is prepared in bands. */
  levels?: Levels;
};

/** The prepared grayscale (before halftoning), with the coverage mask: also the grayscale master. */
/**
 * `mask` is undefined when everything is inside the subject (an opaque photo and no cut-out),
 * which spares a full-size mask and its pass over the image.
 */
export function prepareGray(photo: Rgba8, settings: PrepOnly): { gray: GrayF; mask: Mask | undefined } {
  let gray = rgbaToGray(photo, settings.luma ?? 'bt709');
  const needsMask = Boolean(settings.cutout?.startMask || settings.cutout?.strokes?.length) || !isOpaque(photo);
  if (!needsMask) {
    const levels = settings.levels ?? (settings.autoLevelsClip ? levelsFor(gray, settings.autoLevelsClip) : undefined);
    if (levels) gray = applyLevels(gray, levels);
    return { gray: finishGray(gray, settings), mask: undefined };
  }
  let mask = settings.cutout?.startMask ?? maskFromAlpha(photo);
  if (settings.cutout?.strokes?.length) mask = paintStrokes(mask, settings.cutout.strokes);
  if (settings.cutout?.featherRadius) mask = featherMask(mask, settings.cutout.featherRadius);
  const levels = settings.levels ?? (settings.autoLevelsClip ? levelsFor(gray, settings.autoLevelsClip, toOnOff(mask)) : undefined);
  if (levels) gray = applyLevels(gray, levels);
  return { gray: finishGray(gray, settings), mask };
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
  const { gray, mask } = prepareGray(photo, settings);
  if (!mask) return halftone(gray, settings.halftone);
  const { image, inside } = applyMask(gray, mask);
  return halftone(image, { ...settings.halftone, mask: inside });
}

function toOnOff(mask: Mask): Uint8Array {
  const out = new Uint8Array(mask.data.length);
  for (let i = 0; i < out.length; i++) out[i] = mask.data[i]! > 0.5 ? 1 : 0;
  return out;
}

/**
 * The grayscale master in bands of rows, for large outputs (an 8 × 10 in master at 1000 ppi is
 * 80 megapixels): each band is prepared with enough rows around it for the sharpening and the
 * feather to see their neighbours, and only its own rows are kept, as 8-bit gray and alpha.
 * Memory is the photo plus the two 8-bit results plus one band's working copies.
 */
export function prepareMaster(photo: Rgba8, settings: PrepOnly, bandRows = 256): { width: number; height: number; gray: Uint8Array; alpha: Uint8Array } {
  const { width, height } = photo;
  const gray = new Uint8Array(width * height);
  const alpha = new Uint8Array(width * height);
  const sigma = settings.sharpen?.radius ?? 0;
  const overlap = Math.ceil(3 * sigma) + Math.ceil(1.5 * (settings.cutout?.featherRadius ?? 0)) + 4;
  // Auto-levels must see the whole photo, not one band.
  let levels = settings.levels;
  if (!levels && settings.autoLevelsClip) {
    const whole = prepareGray(photo, { luma: settings.luma, negative: false, cutout: settings.cutout });
    levels = levelsFor(whole.gray, settings.autoLevelsClip, whole.mask && toOnOff(whole.mask));
  }
  for (let top = 0; top < height; top += bandRows) {
    const from = Math.max(0, top - overlap);
    const to = Math.min(height, top + bandRows + overlap);
    const band: Rgba8 = { width, height: to - from, data: photo.data.subarray(from * width * 4, to * width * 4) };
    const strokes = settings.cutout?.strokes?.map((s) => ({ ...s, points: s.points.map(([x, y]) => [x, y - from] as [number, number]) }));
    const startMask = settings.cutout?.startMask && { width, height: to - from, data: settings.cutout.startMask.data.subarray(from * width, to * width) };
    const prepared = prepareGray(band, { ...settings, levels, autoLevelsClip: undefined, cutout: settings.cutout && { ...settings.cutout, strokes, startMask } });
    const keepFrom = (top - from) * width;
    const keepRows = Math.min(bandRows, height - top);
    for (let i = 0; i < keepRows * width; i++) {
      const v = Math.round(prepared.gray.data[keepFrom + i]!);
      gray[top * width + i] = v < 0 ? 0 : v > 255 ? 255 : v;
      const c = prepared.mask ? prepared.mask.data[keepFrom + i]! : 1;
      alpha[top * width + i] = Math.round((c < 0 ? 0 : c > 1 ? 1 : c) * 255);
    }
  }
  return { width, height, gray, alpha };
}
