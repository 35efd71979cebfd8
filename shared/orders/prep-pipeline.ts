import type { Rgba8 } from '../imaging/image.ts';
import { maskFromAlpha, plainBackgroundMask, type Mask, type Stroke } from '../imaging/mask.ts';
import type { PrepSettings as PipelineSettings } from '../imaging/pipeline.ts';
import type { Cutout, PrepSettings } from '../schemas/prep.ts';

/** Auto levels clip this share of pixels at each end (common practice, no source). */
export const AUTO_LEVELS_CLIP = 0.005;

/** Brush strokes from the area's 0–1 coordinates to an image's pixels. */
export function strokesInPixels(cutout: Cutout, width: number, height: number): Stroke[] {
  return cutout.strokes.map((s) => ({ mode: s.mode, width: s.size * width, points: s.points.map(([x, y]) => [x * width, y * height] as [number, number]) }));
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
 * An item's prep settings as the imaging pipeline takes them, for a photo already placed at the
 * output's pixel size (the engrave file and the grayscale master are made from the same).
 */
export function pipelineSettings(prep: PrepSettings, photo: Rgba8): PipelineSettings {
  return {
    luma: 'bt709',
    autoLevelsClip: prep.autoLevels ? AUTO_LEVELS_CLIP : undefined,
    tone: { brightness: prep.brightness, contrast: prep.contrast, gamma: prep.gamma },
    sharpen: { amount: prep.sharpenAmount, radius: prep.sharpenRadius, threshold: prep.sharpenThreshold },
    negative: prep.negative,
    cutout: { strokes: strokesInPixels(prep.cutout, photo.width, photo.height), featherRadius: prep.featherRadius, startMask: startMask(photo, prep.cutout) },
    halftone: { method: prep.halftoneMethod, pixelsPerInch: prep.linesPerInch },
  };
}
