import type { Placement } from '#shared/schemas/checkout.ts';

/**
 * Where the photo sits in the engraving area, as the buyer moves it. The photo is turned by
 * `rotation` degrees (clockwise) and mirrored if asked about the window's centre; the window has
 * the area's proportions. `fill` starts with the window inside the photo (no empty margins),
 * `fit` with the whole photo inside the window. Coordinates are the original photo's pixels.
 */
export type Framing = { centreX: number; centreY: number; zoom: number; rotation: number; flip: boolean; mode: 'fill' | 'fit' };

export const MIN_ZOOM = 1;
export const MAX_ZOOM = 8;

export const startFraming = (photo: { width: number; height: number }, mode: Framing['mode'] = 'fill'): Framing => ({
  centreX: photo.width / 2,
  centreY: photo.height / 2,
  zoom: 1,
  rotation: 0,
  flip: false,
  mode,
});

/** The window's size in photo pixels for an area of this aspect (width / height). */
export function windowSize(photo: { width: number; height: number }, aspect: number, framing: Framing): { width: number; height: number } {
  const quarterTurn = Math.abs(Math.round(framing.rotation / 90)) % 2 === 1;
  const [pw, ph] = quarterTurn ? [photo.height, photo.width] : [photo.width, photo.height];
  // fill: the largest window of this aspect inside the photo; fit: the smallest around it.
  const fillWidth = Math.min(pw, ph * aspect);
  const fitWidth = Math.max(pw, ph * aspect);
  const width = (framing.mode === 'fill' ? fillWidth : fitWidth) / framing.zoom;
  return { width, height: width / aspect };
}

/** Keeps a filling window's centre where the window stays on the photo. */
export function clampFraming(photo: { width: number; height: number }, aspect: number, framing: Framing): Framing {
  const zoom = Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, framing.zoom));
  const next = { ...framing, zoom };
  if (framing.mode === 'fit' || framing.rotation % 90 !== 0) return next;
  const win = windowSize(photo, aspect, next);
  const quarterTurn = Math.abs(Math.round(framing.rotation / 90)) % 2 === 1;
  const [halfW, halfH] = quarterTurn ? [win.height / 2, win.width / 2] : [win.width / 2, win.height / 2];
  const clamp = (v: number, lo: number, hi: number) => (lo > hi ? (lo + hi) / 2 : Math.min(hi, Math.max(lo, v)));
  return {
    ...next,
    centreX: clamp(framing.centreX, halfW, photo.width - halfW),
    centreY: clamp(framing.centreY, halfH, photo.height - halfH),
  };
}

export function toPlacement(photo: { width: number; height: number }, aspect: number, framing: Framing): Placement {
  const win = windowSize(photo, aspect, framing);
  const round = (v: number) => Math.round(v * 100) / 100;
  return {
    crop: {
      left: round(framing.centreX - win.width / 2),
      top: round(framing.centreY - win.height / 2),
      width: round(win.width),
      height: round(win.height),
    },
    rotation: ((((framing.rotation + 180) % 360) + 360) % 360) - 180,
    flipHorizontal: framing.flip,
  };
}

/**
 * The crop as the photo checks see it: the part of the window the photo covers, at the photo's
 * own pixel scale. Empty margins (fit) add no detail, so the effective pixels per inch follow
 * the window's scale, which is the photo's.
 */
export const checkedCrop = (placement: Placement) => ({ width: placement.crop.width, height: placement.crop.height });

/** Fine straightening on top of quarter turns, within ±15°. */
export const MAX_STRAIGHTEN = 15;
export const quarterTurnsOf = (rotation: number) => Math.round(rotation / 90);
/** What is left of a rotation once its quarter turns are taken out: the fine straightening. */
export const straightening = (rotation: number) => rotation - quarterTurnsOf(rotation) * 90;
/** A quarter turn more or less, keeping the straightening, within −180…180. */
export const turned = (rotation: number, by: 90 | -90) => ((((rotation + by + 180) % 360) + 360) % 360) - 180;
export const formatDegrees = (degrees: number) => `${degrees > 0 ? '+' : degrees < 0 ? '−' : ''}${Math.abs(degrees).toFixed(1)}°`;

/**
 * Whether the window reaches past the photo, leaving part of the engraving area blank: the
 * window's extent on the photo, turned by its rotation, against the photo's own edges (half a
 * pixel of slack for rounding).
 */
export function leavesAreaEmpty(photo: { width: number; height: number }, placement: Placement): boolean {
  const { left, top, width, height } = placement.crop;
  const angle = (placement.rotation * Math.PI) / 180;
  const [cos, sin] = [Math.abs(Math.cos(angle)), Math.abs(Math.sin(angle))];
  const halfX = (width / 2) * cos + (height / 2) * sin;
  const halfY = (width / 2) * sin + (height / 2) * cos;
  const [cx, cy] = [left + width / 2, top + height / 2];
  const slack = 0.5;
  return cx - halfX < -slack || cy - halfY < -slack || cx + halfX > photo.width + slack || cy + halfY > photo.height + slack;
}
