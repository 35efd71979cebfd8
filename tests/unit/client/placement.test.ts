import { describe, expect, it } from 'vitest';
import {
  clampFraming,
  formatDegrees,
  leavesAreaEmpty,
  MAX_ZOOM,
  quarterTurnsOf,
  startFraming,
  straightening,
  toPlacement,
  turned,
  windowSize,
  type Framing,
} from '#src/features/designer/placement.ts';

// Worked by hand throughout: a 4000 × 3000 px photo (4:3 landscape) placed in areas of other
// proportions. "Fill" is the largest window of the area's proportions inside the photo; "fit" is
// the smallest around it.
const photo = { width: 4000, height: 3000 };
const framing = (change: Partial<Framing> = {}): Framing => ({ ...startFraming(photo), ...change });

describe('placement maths (worked by hand)', () => {
  it('fills a square area with the photo’s full height: a 3000 × 3000 window', () => {
    expect(windowSize(photo, 1, framing())).toEqual({ width: 3000, height: 3000 });
  });

  it('fits the whole photo in a square area: a 4000 × 4000 window with margins above and below', () => {
    expect(windowSize(photo, 1, framing({ mode: 'fit' }))).toEqual({ width: 4000, height: 4000 });
  });

  it('fills an 8 × 10 portrait area (aspect 0.8) from the height: 2400 × 3000', () => {
    expect(windowSize(photo, 0.8, framing())).toEqual({ width: 2400, height: 3000 });
  });

  it('swaps the photo’s sides for a quarter turn: turned, it is 3000 × 4000, so a square window is 3000 wide', () => {
    expect(windowSize(photo, 1, framing({ rotation: 90 }))).toEqual({ width: 3000, height: 3000 });
    expect(windowSize(photo, 0.75, framing({ rotation: -90 }))).toEqual({ width: 3000, height: 4000 });
  });

  it('zoom 2 halves the window’s sides', () => {
    expect(windowSize(photo, 1, framing({ zoom: 2 }))).toEqual({ width: 1500, height: 1500 });
  });

  it('keeps a filling window on the photo: a centre dragged past the corner comes back to half a window in', () => {
    const clamped = clampFraming(photo, 1, framing({ centreX: -500, centreY: 99_999 }));
    expect(clamped).toMatchObject({ centreX: 1500, centreY: 1500 });
    const zoomed = clampFraming(photo, 1, framing({ zoom: 2, centreX: 3900, centreY: 100 }));
    expect(zoomed).toMatchObject({ centreX: 4000 - 750, centreY: 750 });
  });

  it('limits zoom to 1…8 and leaves a fitted or straightened window where the buyer put it', () => {
    expect(clampFraming(photo, 1, framing({ zoom: 40 })).zoom).toBe(MAX_ZOOM);
    expect(clampFraming(photo, 1, framing({ zoom: 0.2 })).zoom).toBe(1);
    expect(clampFraming(photo, 1, framing({ mode: 'fit', centreX: -10 })).centreX).toBe(-10);
    expect(clampFraming(photo, 1, framing({ rotation: 7, centreX: -10 })).centreX).toBe(-10);
  });

  it('turns a framing into the placement the server burns: crop in photo pixels, rotation within ±180°', () => {
    expect(toPlacement(photo, 1, framing())).toEqual({
      crop: { left: 500, top: 0, width: 3000, height: 3000 },
      rotation: 0,
      flipHorizontal: false,
    });
    expect(toPlacement(photo, 1, framing({ rotation: 270, flip: true })).rotation).toBe(-90);
    expect(toPlacement(photo, 1, framing({ rotation: -190 })).rotation).toBe(170);
    expect(toPlacement(photo, 1, framing({ rotation: 180 })).rotation).toBe(-180);
  });

  it('rounds the crop to hundredths of a pixel: 4000 / 3 zoomed windows stay exact enough for the server’s 0.5 % check', () => {
    const { crop } = toPlacement(photo, 1, framing({ zoom: 3 }));
    expect(crop).toEqual({ left: 1500, top: 1000, width: 1000, height: 1000 });
    const odd = toPlacement({ width: 1001, height: 1000 }, 1.5, startFraming({ width: 1001, height: 1000 }));
    expect(odd.crop).toEqual({ left: 0, top: 166.33, width: 1001, height: 667.33 });
  });

  it('keeps quarter turns apart from fine straightening: 92.5° is one turn and +2.5°, and a turn keeps the +2.5°', () => {
    expect([quarterTurnsOf(92.5), straightening(92.5)]).toEqual([1, 2.5]);
    expect([quarterTurnsOf(-100), straightening(-100)]).toEqual([-1, -10]);
    expect(turned(92.5, 90)).toBe(-177.5);
    expect(turned(-177.5, -90)).toBe(92.5);
    expect(turned(0, -90)).toBe(-90);
    expect([formatDegrees(2.5), formatDegrees(-10), formatDegrees(0)]).toEqual(['+2.5°', '−10.0°', '0.0°']);
  });

  it('tells when the placed photo leaves part of the area empty (worked by hand)', () => {
    // Filling a square area: the 3000 × 3000 window sits inside the 4000 × 3000 photo.
    expect(leavesAreaEmpty(photo, toPlacement(photo, 1, framing()))).toBe(false);
    // Showing it all: a 4000 × 4000 window, 500 px of empty area above and below.
    expect(leavesAreaEmpty(photo, toPlacement(photo, 1, framing({ mode: 'fit' })))).toBe(true);
    // Straightened by 10°, the filling window's corners swing out: (1500 cos 10° + 1500 sin 10°) = 1738 > 1500.
    expect(leavesAreaEmpty(photo, toPlacement(photo, 1, framing({ rotation: 10 })))).toBe(true);
    // Zoomed in 1.5×, a 2000 px window turned 10° reaches 1158 px from the centre: inside.
    expect(leavesAreaEmpty(photo, toPlacement(photo, 1, framing({ rotation: 10, zoom: 1.5 })))).toBe(false);
  });
});
