import { useEffect, useMemo, useRef, useState, type RefObject } from 'react';
import type { StorefrontCatalog } from '#shared/schemas/catalog.ts';
import type { Inscription } from '#shared/schemas/checkout.ts';
import { formatSize, type LengthUnit } from '#shared/units.ts';
import { Notice } from '#src/components/ui/notice.tsx';
import { cx } from '#src/lib/cx.ts';
import { useSteadyValue } from '#src/lib/use-steady-value.ts';
import { drawInscription } from '../inscription.ts';
import { useFramingGestures, type FramingState } from '../use-framing.ts';
import { useMockup } from '../use-mockup.ts';

type Blank = StorefrontCatalog['blanks'][number];
export type View = 'photo' | 'burn';

const shapeRadius = { rectangle: '4px', 'rounded-rectangle': '7%', oval: '50%', circle: '50%' } as const;
const STAGE = { width: 460, height: 520 };
/** The stage's padding (p-6 on both sides) and the blank's 18-pixel rim around the canvas, both sides. */
const STAGE_PADDING = 2 * 24 + 36;

/** The width left inside an element once `padding` is taken off, at most `max`; follows resizes. */
function useAvailableWidth(element: RefObject<HTMLElement | null>, max: number, padding: number): number {
  const [width, setWidth] = useState(max);
  useEffect(() => {
    const node = element.current;
    if (!node) return;
    const measure = () => setWidth(Math.max(120, Math.min(max, node.clientWidth - padding)));
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(node);
    return () => observer.disconnect();
  }, [element, max, padding]);
  return width;
}

/**
 * The blank in its material's colour with the engraving area as a canvas: the mock-up drawn by
 * the worker from the placement (as it will burn, or the plain photo), the lettering on top, and
 * the photo moved by hand. At most 460 × 520 screen pixels, narrower on a phone: the canvas is
 * drawn at the size it is shown, so dragging moves the photo with the finger.
 */
export function DesignerStage({
  blank,
  units,
  area,
  framing: framingState,
  inscription,
  view,
  onView,
}: {
  blank: Blank;
  units: LengthUnit;
  area: { widthMm: number; heightMm: number };
  framing: FramingState;
  inscription: Inscription & { on: boolean };
  view: View;
  onView(view: View): void;
}) {
  const { photo, placement } = framingState;
  const stage = useRef<HTMLDivElement>(null);
  const stageWidth = useAvailableWidth(stage, STAGE.width, STAGE_PADDING);
  const pxPerMm = Math.min(stageWidth / area.widthMm, STAGE.height / area.heightMm);
  const canvasSize = useSteadyValue({ width: Math.round(area.widthMm * pxPerMm), height: Math.round(area.heightMm * pxPerMm) });
  const gestures = useFramingGestures(framingState, placement ? placement.crop.width / canvasSize.width : 1);

  const mockup = useMockup(photo);
  const canvas = useRef<HTMLCanvasElement>(null);
  const look = useMemo(
    () => ({ shape: blank.shape, surfaceColour: blank.material.surfaceColour, markColour: blank.material.markColour, ...blank.look }),
    [blank],
  );

  const { ready: mockupReady, render: renderMockup, result } = mockup;
  useEffect(() => {
    if (!placement || !mockupReady) return;
    // No prep given: the worker uses the recipe's own (`recipePrep`), as the burn will.
    renderMockup({ size: canvasSize, placement, look, areaWidthMm: area.widthMm, view });
  }, [mockupReady, renderMockup, placement, canvasSize, look, view, area.widthMm]);

  useEffect(() => {
    const ctx = canvas.current?.getContext('2d');
    if (!ctx) return;
    ctx.clearRect(0, 0, canvasSize.width, canvasSize.height);
    if (result) ctx.drawImage(result.image, 0, 0, canvasSize.width, canvasSize.height);
    if (inscription.on) drawInscription(ctx, inscription, canvasSize, view === 'burn' ? look.markColour : '#ffffff', view === 'photo');
  }, [result, inscription, view, look.markColour, canvasSize]);

  return (
    <div className="flex flex-col items-center gap-3">
      <div ref={stage} className="flex w-full items-center justify-center rounded-card bg-graphite-100 p-6 sm:min-h-[560px]">
        <div
          className="relative flex items-center justify-center shadow-lg"
          style={{
            width: canvasSize.width + 36,
            height: canvasSize.height + 36,
            background: blank.material.surfaceColour,
            borderRadius: shapeRadius[blank.shape],
          }}
        >
          <canvas
            ref={canvas}
            width={canvasSize.width}
            height={canvasSize.height}
            tabIndex={photo ? 0 : -1}
            data-drawn={result ? 'true' : undefined}
            role="img"
            aria-label={
              photo
                ? `Mock-up of your photo ${view === 'burn' ? 'as it will burn' : 'as uploaded'}. Drag or use the arrow keys to move it, + and − to zoom.`
                : 'The engraving area; upload a photo to see it here.'
            }
            {...gestures}
            className={cx('touch-none outline-offset-4', photo ? 'cursor-grab active:cursor-grabbing' : '')}
            style={{ outline: photo ? undefined : `2px dashed ${blank.material.markColour}` }}
          />
        </div>
      </div>
      <div className="flex items-center gap-3 text-sm">
        <div role="group" aria-label="Show" className="inline-flex rounded-full bg-white p-1 ring-1 ring-graphite-200">
          {(['burn', 'photo'] as const).map((v) => (
            <button
              key={v}
              type="button"
              aria-pressed={view === v}
              onClick={() => onView(v)}
              className={cx(
                'min-h-9 rounded-full px-3 py-1 font-semibold',
                view === v ? 'bg-graphite-900 text-white' : 'text-graphite-700',
              )}
            >
              {v === 'burn' ? 'As it will burn' : 'Your photo'}
            </button>
          ))}
        </div>
      </div>
      {mockup.error && <Notice tone="error">{mockup.error}</Notice>}
      <p className="text-center text-xs text-graphite-500">
        Engraving area {formatSize(area.widthMm, area.heightMm, units)}. The mock-up shows the dot pattern at screen size; the laser burns
        it far finer.
      </p>
    </div>
  );
}
