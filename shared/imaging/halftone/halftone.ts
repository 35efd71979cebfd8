import type { Bitmap, GrayF } from '../image.ts';
import { DIFFUSION_KERNELS, type DiffusionKernelId } from './kernels.ts';
import { errorDiffuse } from './error-diffusion.ts';
import { orderedDither, thresholdDither } from './ordered.ts';
import { clusteredDot } from './clustered.ts';

/** Every halftone method a recipe may name, with the words shown to people. */
export const HALFTONE_METHODS = {
  ...(Object.fromEntries(Object.entries(DIFFUSION_KERNELS).map(([id, k]) => [id, k.name])) as Record<DiffusionKernelId, string>),
  'bayer-2': 'Ordered (Bayer 2 × 2)',
  'bayer-4': 'Ordered (Bayer 4 × 4)',
  'bayer-8': 'Ordered (Bayer 8 × 8)',
  clustered: 'Clustered dots',
  threshold: 'Threshold',
} as const;

export type HalftoneMethod = keyof typeof HALFTONE_METHODS;

export type HalftoneOptions = {
  method: HalftoneMethod;
  scan?: 'raster' | 'serpentine';
  /** For clustered dots: screen frequency and angle; pixelsPerInch is the output's line density. */
  cellsPerInch?: number;
  angleDegrees?: number;
  pixelsPerInch?: number;
  mask?: Uint8Array;
};

export function halftone(image: GrayF, options: HalftoneOptions): Bitmap {
  const { method, mask } = options;
  if (method === 'threshold') return thresholdDither(image, 127.5, mask);
  if (method === 'bayer-2' || method === 'bayer-4' || method === 'bayer-8')
    return orderedDither(image, Number(method.slice(6)) as 2 | 4 | 8, mask);
  if (method === 'clustered') {
    return clusteredDot(image, {
      cellsPerInch: options.cellsPerInch ?? 60,
      pixelsPerInch: options.pixelsPerInch ?? 360,
      angleDegrees: options.angleDegrees,
      mask,
    });
  }
  return errorDiffuse(image, { kernel: method, scan: options.scan ?? 'serpentine', mask });
}
