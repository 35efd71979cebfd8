import { useEffect, useRef, type KeyboardEvent, type PointerEvent, type WheelEvent } from 'react';
import { buyerPhotoSchema, type BuyerPhotoView } from '#shared/schemas/photos.ts';
import { useSessionState } from '#src/lib/use-session-state.ts';
import { useSteadyValue } from '#src/lib/use-steady-value.ts';
import { clampFraming, startFraming, toPlacement, type Framing } from './placement.ts';

const isFraming = (v: unknown): v is Framing =>
  typeof v === 'object' &&
  v !== null &&
  ['centreX', 'centreY', 'zoom', 'rotation'].every((k) => typeof (v as Record<string, unknown>)[k] === 'number') &&
  ['fill', 'fit'].includes((v as Framing).mode);

/**
 * The buyer's photo and how it sits in an area of this aspect (width / height): choosing a photo
 * starts a filling framing; every change goes through `frame`, which keeps the window on the
 * photo; `placement` is what checkout sends and the burn uses.
 */
export function useFraming(aspect: number, keepAs: string) {
  // Kept for the tab: a reload finds the photo (already stored) where the buyer put it.
  const [photo, setPhoto] = useSessionState<BuyerPhotoView | undefined>(
    `${keepAs}:photo`,
    undefined,
    (v) => buyerPhotoSchema.safeParse(v).success,
  );
  const [framing, setFraming] = useSessionState<Framing | undefined>(`${keepAs}:framing`, undefined, isFraming);
  const placement = useSteadyValue(photo && framing ? toPlacement(photo, aspect, framing) : undefined);

  // A new aspect (another size or turn) can leave the window outside the photo: pull it back in.
  useEffect(() => {
    if (photo) setFraming((f) => f && clampFraming(photo, aspect, f));
  }, [photo, aspect, setFraming]);

  const choose = (next: BuyerPhotoView) => {
    setPhoto(next);
    setFraming(startFraming(next));
  };
  const frame = (change: (f: Framing) => Framing) => photo && setFraming((f) => f && clampFraming(photo, aspect, change(f)));
  return { photo, framing, placement, choose, frame };
}

export type FramingState = ReturnType<typeof useFraming>;

/**
 * Dragging, arrow keys, + and − and the wheel move the photo under the window: screen pixels
 * become photo pixels at the window's scale, turned with the photo.
 */
export function useFramingGestures({ framing, frame }: FramingState, photoPixelsPerScreenPixel: number) {
  const drag = useRef<{ x: number; y: number } | undefined>(undefined);
  const onPointerDown = (e: PointerEvent<HTMLCanvasElement>) => {
    drag.current = { x: e.clientX, y: e.clientY };
    e.currentTarget.setPointerCapture(e.pointerId);
  };
  const onPointerMove = (e: PointerEvent<HTMLCanvasElement>) => {
    if (!drag.current || !framing) return;
    const dx = e.clientX - drag.current.x;
    const dy = e.clientY - drag.current.y;
    drag.current = { x: e.clientX, y: e.clientY };
    const angle = (-framing.rotation * Math.PI) / 180;
    const [rx, ry] = [dx * Math.cos(angle) - dy * Math.sin(angle), dx * Math.sin(angle) + dy * Math.cos(angle)];
    frame((f) => ({
      ...f,
      centreX: f.centreX - (f.flip ? -rx : rx) * photoPixelsPerScreenPixel,
      centreY: f.centreY - ry * photoPixelsPerScreenPixel,
    }));
  };
  const onPointerUp = () => (drag.current = undefined);
  const onKeyDown = (e: KeyboardEvent<HTMLCanvasElement>) => {
    const step = 10 * photoPixelsPerScreenPixel;
    const moves: Record<string, (f: Framing) => Framing> = {
      ArrowLeft: (f) => ({ ...f, centreX: f.centreX + step }),
      ArrowRight: (f) => ({ ...f, centreX: f.centreX - step }),
      ArrowUp: (f) => ({ ...f, centreY: f.centreY + step }),
      ArrowDown: (f) => ({ ...f, centreY: f.centreY - step }),
      '+': (f) => ({ ...f, zoom: f.zoom * 1.1 }),
      '-': (f) => ({ ...f, zoom: f.zoom / 1.1 }),
    };
    const move = moves[e.key];
    if (move) {
      e.preventDefault();
      frame(move);
    }
  };
  const onWheel = (e: WheelEvent<HTMLCanvasElement>) => frame((f) => ({ ...f, zoom: f.zoom * (e.deltaY < 0 ? 1.08 : 1 / 1.08) }));
  return { onPointerDown, onPointerMove, onPointerUp, onKeyDown, onWheel };
}
