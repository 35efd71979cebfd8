import type { Bitmap, GrayF, Rgba8 } from './image.ts';
import { rgbaToGray, type LumaMode } from './luma.ts';
import { adjustTone, autoLevels, invert, type ToneOptions } from './tone.ts';
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

/** The prepared grayscale (before halftoning), with the coverage mask: also the grayscale master. */
export function prepareGray(photo: Rgba8, settings: Omit<PrepSettings, 'halftone'>): { gray: GrayF; mask: Mask } {
  let gray = rgbaToGray(photo, settings.luma ?? 'bt709');
  let mask = settings.cutout?.startMask ?? maskFromAlpha(photo);
  if (settings.cutout?.strokes?.length) mask = paintStrokes(mask, settings.cutout.strokes);
  if (settings.cutout?.featherRadius) mask = featherMask(mask, settings.cutout.featherRadius);
  if (settings.autoLevelsClip) gray = autoLevels(gray, settings.autoLevelsClip, toOnOff(mask));
  if (settings.tone) gray = adjustTone(gray, settings.tone);
  if (settings.sharpen && settings.sharpen.amount > 0) gray = unsharpMask(gray, settings.sharpen);
  if (settings.negative) gray = invert(gray);
  return { gray, mask };
}

export function renderBitmap(photo: Rgba8, settings: PrepSettings): Bitmap {
  const { gray, mask } = prepareGray(photo, settings);
  const { image, inside } = applyMask(gray, mask);
  return halftone(image, { ...settings.halftone, mask: inside });
}

function toOnOff(mask: Mask): Uint8Array {
  const out = new Uint8Array(mask.data.length);
  for (let i = 0; i < out.length; i++) out[i] = mask.data[i]! > 0.5 ? 1 : 0;
  return out;
}
