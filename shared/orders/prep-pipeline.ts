import type { Rgba8 } from '../imaging/image.ts';
import { maskFromAlpha, plainBackgroundMask, type Mask, type Stroke } from '../imaging/mask.ts';
import type { PrepSettings as PipelineSettings } from '../imaging/pipeline.ts';
import type { BlankShape } from '../imaging/shape.ts';
import type { HalftoneMethod } from '../imaging/halftone/halftone.ts';
import { MM_PER_INCH } from '../imaging/sizing.ts';
import { NO_CUTOUT, type Cutout, type PrepSettings } from '../schemas/prep.ts';

/** Auto levels clip this share of pixels at each end (common practice, no source). */
export const AUTO_LEVELS_CLIP = 0.005;

/**
 * The prep an item starts with, from how its recipe burns (tone, halftone and line density):
 * the storefront's mock-up, the staff preview, the proof and the burn all start from these.
 * Contrast +10 and hard sharpening at σ 2 output pixels make up for the softening of the burn
 * (common practice, no source).
 */
export function recipePrep(look: { tone: 'positive' | 'negative'; halftoneMethod: HalftoneMethod; linesPerInch: number }): PrepSettings {
  return {
    brightness: 0,
    contrast: 10,
    gamma: 1,
    autoLevels: true,
    sharpenAmount: 150,
    sharpenRadius: 2,
    sharpenThreshold: 2,
    halftoneMethod: look.halftoneMethod,
    linesPerInch: look.linesPerInch,
    negative: look.tone === 'negative',
    featherRadius: 4,
    cutout: NO_CUTOUT,
  };
}

/**
 * The same prep for a picture of the area `widthPx` pixels wide instead of the burn's: the
 * sharpening radius and the feather are in output pixels, so they scale with the picture (the
 * radius no finer than half a pixel), and the line density becomes the picture's own. The one
 * way the mock-up, the staff preview and the proof shrink the burn to their size.
 */
export function prepAtWidth(prep: PrepSettings, areaWidthMm: number, widthPx: number): PrepSettings {
  const linesPerInch = widthPx / (areaWidthMm / MM_PER_INCH);
  const scale = linesPerInch / prep.linesPerInch;
  return { ...prep, sharpenRadius: Math.max(0.5, prep.sharpenRadius * scale), featherRadius: prep.featherRadius * scale, linesPerInch };
}

/** Brush strokes from the area's 0–1 coordinates to an image's pixels. */
export function strokesInPixels(cutout: Cutout, width: number, height: number): Stroke[] {
  return cutout.strokes.map((s) => ({
    mode: s.mode,
    width: s.size * width,
    points: s.points.map(([x, y]) => [x * width, y * height] as [number, number]),
  }));
}

/**
 * The cut-out's starting mask for a placed photo: the photo's own coverage (margins where the
 * window reaches past the photo stay out), and without its plain background when asked.
 */
export function startMask(photo: Rgba8, cutout: Cutout): Mask | undefined {
  if (cutout.start !== 'plain-background') return undefined;
  const plain = plainBackgroundMask(photo, cutout.tolerance);
  const alpha = maskFromAlpha(photo);
  for (let i = 0; i < plain.data.length; i++) plain.data[i] = Math.min(plain.data[i]!, alpha.data[i]!);
  return plain;
}

/**
 * The tone side of an item's prep as the imaging pipeline takes it: luma, levels, tone,
 * sharpening, negative and the blank's shape, without the cut-out (which depends on the photo).
 */
export function gradeSettings(prep: PrepSettings, shape: BlankShape): Omit<PipelineSettings, 'cutout' | 'halftone'> {
  return {
    luma: 'bt709',
    autoLevelsClip: prep.autoLevels ? AUTO_LEVELS_CLIP : undefined,
    tone: { brightness: prep.brightness, contrast: prep.contrast, gamma: prep.gamma },
    sharpen: { amount: prep.sharpenAmount, radius: prep.sharpenRadius, threshold: prep.sharpenThreshold },
    negative: prep.negative,
    shape,
  };
}

/**
 * An item's prep settings as the imaging pipeline takes them, for a photo already placed at the
 * output's pixel size (the engrave file, the proof, the 1:1 region and the mock-up alike).
 */
export function pipelineSettings(prep: PrepSettings, photo: Rgba8, shape: BlankShape): PipelineSettings {
  return {
    ...gradeSettings(prep, shape),
    cutout: {
      strokes: strokesInPixels(prep.cutout, photo.width, photo.height),
      featherRadius: prep.featherRadius,
      startMask: startMask(photo, prep.cutout),
    },
    halftone: { method: prep.halftoneMethod, pixelsPerInch: prep.linesPerInch },
  };
}
