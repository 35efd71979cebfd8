import type { HalftoneMethod } from '#shared/imaging/halftone/halftone.ts';
import type { BlankShape } from '#shared/schemas/catalog.ts';
import type { Placement } from '#shared/schemas/checkout.ts';
import type { PrepSettings } from '#shared/schemas/prep.ts';

/** Messages between the page and the mock-up worker. */
export type MockupLook = {
  shape: BlankShape;
  surfaceColour: string;
  markColour: string;
  tone: 'positive' | 'negative';
  halftoneMethod: HalftoneMethod;
  linesPerInch: number;
};

export type MockupJob = {
  id: number;
  /** Screen pixels of the engraving area. */
  size: { width: number; height: number };
  placement: Placement;
  look: MockupLook;
  /** The engraving area's width, which relates the burn's pixels to the screen's. */
  areaWidthMm: number;
  /**
   * The prep at the burn's resolution, shrunk to the screen by the worker with `prepAtWidth`
   * as the proof is: staff's current prep, or (the storefront) the recipe's own, `recipePrep`.
   * In the photo view its cut-out fades what is cut away.
   */
  prep?: PrepSettings;
  view: 'photo' | 'burn';
};

export type MockupRequest = { type: 'photo'; bitmap: ImageBitmap; previewScale: number } | { type: 'render'; job: MockupJob };
export type MockupReply =
  { type: 'rendered'; id: number; image: ImageBitmap; ms: number } | { type: 'failed'; id: number; message: string };
