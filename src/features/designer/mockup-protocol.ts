import type { HalftoneMethod } from '../../../shared/imaging/halftone/halftone.ts';
import type { BlankShape } from '../../../shared/schemas/catalog.ts';
import type { Placement } from '../../../shared/schemas/checkout.ts';
import type { ToneOptions } from '../../../shared/imaging/tone.ts';
import type { Cutout } from '../../../shared/schemas/prep.ts';

/** Messages between the page and the mock-up worker. */
export type MockupLook = { shape: BlankShape; surfaceColour: string; markColour: string; tone: 'positive' | 'negative'; halftoneMethod: HalftoneMethod; linesPerInch: number };

export type MockupJob = {
  id: number;
  /** Screen pixels of the engraving area. */
  size: { width: number; height: number };
  placement: Placement;
  look: MockupLook;
  tone?: ToneOptions;
  /** Staff prep: their sharpening and auto-levels instead of the storefront's defaults. */
  sharpen?: { amount: number; radius: number; threshold: number };
  autoLevelsClip?: number;
  /** Staff prep's cut-out, with the feather in screen pixels. In the photo view it fades what is cut away. */
  cutout?: { cutout: Cutout; featherRadius: number };
  view: 'photo' | 'burn';
};

export type MockupRequest = { type: 'photo'; bitmap: ImageBitmap; previewScale: number } | { type: 'render'; job: MockupJob };
export type MockupReply = { type: 'rendered'; id: number; image: ImageBitmap; ms: number } | { type: 'failed'; id: number; message: string };
