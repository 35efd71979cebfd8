import { useEffect, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent, type RefObject } from 'react';
import { useNavigate } from 'react-router-dom';
import { effectivePpi, largestFairOffered, verdictFor } from '#shared/imaging/photo-checks.ts';
import { orientedArea } from '#shared/imaging/sizing.ts';
import { formatMoney } from '#shared/money.ts';
import type { StorefrontCatalog } from '#shared/schemas/catalog.ts';
import { INSCRIPTION_FONTS, type Inscription } from '#shared/schemas/checkout.ts';
import type { BuyerPhotoView } from '#shared/schemas/photos.ts';
import type { PublicStudio } from '#shared/studio.ts';
import { formatSize } from '#shared/units.ts';
import { Button } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { cx } from '#src/lib/cx.ts';
import { useSteadyValue } from '#src/lib/use-steady-value.ts';
import { useCart } from '#src/features/cart/index.ts';
import { clampFraming, MAX_ZOOM, startFraming, toPlacement, type Framing } from '../placement.ts';
import { useMockup } from '../use-mockup.ts';
import { drawInscription } from '../inscription.ts';
import { PhotoDrop } from './photo-drop.tsx';

type Blank = StorefrontCatalog['blanks'][number];
type Size = Blank['sizes'][number];
type Orientation = 'portrait' | 'landscape';

const naturalOrientation = (size: Size): Orientation =>
  size.orientation === 'landscape'
    ? 'landscape'
    : size.orientation === 'portrait'
      ? 'portrait'
      : size.areaWidthMm > size.areaHeightMm
        ? 'landscape'
        : 'portrait';
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

/** Fine straightening on top of quarter turns, within ±15°. */
const MAX_STRAIGHTEN = 15;
const quarterTurnsOf = (rotation: number) => Math.round(rotation / 90);
const straightening = (rotation: number) => rotation - quarterTurnsOf(rotation) * 90;
/** A quarter turn more or less, keeping the straightening, within −180…180. */
const turned = (rotation: number, by: 90 | -90) => ((((rotation + by + 180) % 360) + 360) % 360) - 180;
const formatDegrees = (degrees: number) => `${degrees > 0 ? '+' : degrees < 0 ? '−' : ''}${Math.abs(degrees).toFixed(1)}°`;

export function Designer({ studio, blank }: { studio: PublicStudio; blank: Blank }) {
  const cart = useCart(studio.slug);
  const toast = useToast();
  const navigate = useNavigate();
  const available = blank.sizes.filter((s) => s.stock !== 'sold-out');
  const [sizeId, setSizeId] = useState(available[0]?.id ?? blank.sizes[0]?.id ?? '');
  const size = blank.sizes.find((s) => s.id === sizeId) ?? blank.sizes[0]!;
  const [orientation, setOrientation] = useState<Orientation>(naturalOrientation(size));
  const [photo, setPhoto] = useState<BuyerPhotoView>();
  const [framing, setFraming] = useState<Framing>();
  const [view, setView] = useState<'photo' | 'burn'>('burn');
  const [inscription, setInscription] = useState<Inscription & { on: boolean }>({ on: false, lines: [''], font: 'rounded', size: 0.07 });
  const [rights, setRights] = useState(false);
  const [lowConfirmed, setLowConfirmed] = useState(false);
  const [quantity, setQuantity] = useState(1);
  const [tried, setTried] = useState(false);

  const area = orientedArea(size, orientation);
  const aspect = area.widthMm / area.heightMm;
  // Screen size of the area: the whole blank's proportions would need its outer size, which the
  // storefront does not list; the area is what matters to the buyer.
  // The stage is at most 460 × 520 screen pixels, narrower on a phone: the canvas is drawn at
  // the size it is shown, so dragging moves the photo with the finger.
  const stage = useRef<HTMLDivElement>(null);
  const stageWidth = useAvailableWidth(stage, STAGE.width, STAGE_PADDING);
  const pxPerMm = Math.min(stageWidth / area.widthMm, STAGE.height / area.heightMm);
  const canvasSize = useSteadyValue({ width: Math.round(area.widthMm * pxPerMm), height: Math.round(area.heightMm * pxPerMm) });
  const placement = useSteadyValue(photo && framing ? toPlacement(photo, aspect, framing) : undefined);

  const mockup = useMockup(photo);
  const canvas = useRef<HTMLCanvasElement>(null);
  const look = useMemo(
    () => ({ shape: blank.shape, surfaceColour: blank.material.surfaceColour, markColour: blank.material.markColour, ...blank.look }),
    [blank],
  );

  const { ready: mockupReady, render: renderMockup } = mockup;
  useEffect(() => {
    if (!placement || !mockupReady) return;
    // No prep given: the worker uses the recipe's own (`recipePrep`), as the burn will.
    renderMockup({ size: canvasSize, placement, look, areaWidthMm: area.widthMm, view });
  }, [mockupReady, renderMockup, placement, canvasSize, look, view, area.widthMm]);

  useEffect(() => {
    const ctx = canvas.current?.getContext('2d');
    if (!ctx) return;
    ctx.clearRect(0, 0, canvasSize.width, canvasSize.height);
    if (mockup.result) ctx.drawImage(mockup.result.image, 0, 0, canvasSize.width, canvasSize.height);
    if (inscription.on) drawInscription(ctx, inscription, canvasSize, view === 'burn' ? look.markColour : '#ffffff', view === 'photo');
  }, [mockup.result, inscription, view, look.markColour, canvasSize]);

  function choosePhoto(next: BuyerPhotoView) {
    setPhoto(next);
    setFraming(startFraming(next));
    setLowConfirmed(false);
  }
  const frame = (change: (f: Framing) => Framing) => photo && framing && setFraming(clampFraming(photo, aspect, change(framing)));
  // A new aspect (another size or turn) can leave the window outside the photo: pull it back in.
  useEffect(() => {
    if (photo) setFraming((f) => f && clampFraming(photo, aspect, f));
  }, [photo, aspect]);

  // Dragging moves the photo under the window: screen pixels → photo pixels at the window's scale.
  const drag = useRef<{ x: number; y: number } | undefined>(undefined);
  const photoPixelsPerScreenPixel = placement ? placement.crop.width / canvasSize.width : 1;
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

  const ppi = placement ? effectivePpi(placement.crop, area) : undefined;
  const verdict = ppi === undefined ? undefined : verdictFor(ppi);
  const fairer =
    placement && verdict === 'too-low'
      ? largestFairOffered(
          placement.crop,
          blank.sizes.map((s) => ({ ...orientedArea(s, orientation), label: s.label, id: s.id })),
        )
      : undefined;
  const refused = verdict === 'too-low' && studio.lowResolutionPolicy === 'refuse';
  const inscriptionLines = inscription.lines.filter((l) => l.trim());
  const problems = [
    !photo && 'Upload your photo.',
    photo && !rights && 'Confirm that you may use this photo.',
    verdict === 'too-low' && !refused && !lowConfirmed && 'Confirm the low resolution, or choose a smaller size.',
    refused && 'Choose a smaller size or a larger photo.',
    size.stock === 'sold-out' && 'This size is sold out.',
  ].filter(Boolean) as string[];

  function addToCart() {
    setTried(true);
    if (problems.length || !photo || !placement) return;
    cart.add({
      blankId: blank.id,
      sizeId: size.id,
      orientation,
      quantity,
      photoId: photo.id,
      placement,
      inscription:
        inscription.on && inscriptionLines.length ? { lines: inscriptionLines, font: inscription.font, size: inscription.size } : null,
      rightsConfirmed: true,
      lowResolutionConfirmed: verdict === 'too-low' && lowConfirmed,
      blankName: blank.name,
      sizeLabel: size.label,
      priceMinor: size.priceMinor,
      thumbUrl: photo.thumbUrl,
      verdict: verdict!,
    });
    toast.show(`${blank.name}, ${size.label} is in your cart.`, 'success');
    navigate(`/s/${studio.slug}/cart`);
  }

  return (
    <section aria-labelledby="designer-title" className="grid grid-cols-[minmax(0,1fr)] gap-8 lg:grid-cols-[minmax(0,1fr)_minmax(0,26rem)]">
      <div className="flex flex-col items-center gap-3">
        <h2 id="designer-title" className="sr-only">
          Design your {blank.name}
        </h2>
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
              data-drawn={mockup.result ? 'true' : undefined}
              role="img"
              aria-label={
                photo
                  ? `Mock-up of your photo ${view === 'burn' ? 'as it will burn' : 'as uploaded'}. Drag or use the arrow keys to move it, + and − to zoom.`
                  : 'The engraving area; upload a photo to see it here.'
              }
              onPointerDown={onPointerDown}
              onPointerMove={onPointerMove}
              onPointerUp={() => (drag.current = undefined)}
              onKeyDown={onKeyDown}
              onWheel={(e) => frame((f) => ({ ...f, zoom: f.zoom * (e.deltaY < 0 ? 1.08 : 1 / 1.08) }))}
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
                onClick={() => setView(v)}
                className={cx('rounded-full px-3 py-1 font-semibold', view === v ? 'bg-graphite-900 text-white' : 'text-graphite-700')}
              >
                {v === 'burn' ? 'As it will burn' : 'Your photo'}
              </button>
            ))}
          </div>
        </div>
        {mockup.error && <Notice tone="error">{mockup.error}</Notice>}
        <p className="text-center text-xs text-graphite-500">
          Engraving area {formatSize(area.widthMm, area.heightMm, studio.units)}. The mock-up shows the dot pattern at screen size; the
          laser burns it far finer.
        </p>
      </div>

      <div className="flex flex-col gap-6">
        <fieldset className="flex flex-col gap-2">
          <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">1. Size</legend>
          {blank.sizes.map((s) => (
            <label
              key={s.id}
              className={cx(
                'flex items-center justify-between gap-3 rounded-lg border px-4 py-2.5',
                s.id === size.id ? 'border-accent bg-ember-50' : 'border-graphite-200 bg-white',
                s.stock === 'sold-out' && 'opacity-50',
              )}
            >
              <span className="flex items-center gap-3">
                <input
                  type="radio"
                  name="size"
                  value={s.id}
                  checked={s.id === size.id}
                  disabled={s.stock === 'sold-out'}
                  onChange={() => {
                    setSizeId(s.id);
                    setOrientation(s.orientation === 'either' ? orientation : naturalOrientation(s));
                  }}
                  className="accent-[var(--color-accent)]"
                />
                <span>
                  <span className="font-semibold">{s.label}</span>
                  <span className="block text-xs text-graphite-500">
                    {s.stock === 'sold-out' ? 'Sold out' : s.stock === 'few-left' ? 'Only a few left' : 'In stock'}
                  </span>
                </span>
              </span>
              <span className="font-bold">{s.price}</span>
            </label>
          ))}
          {/* A square area reads the same either way round: no choice to offer. */}
          {size.orientation === 'either' && size.areaWidthMm !== size.areaHeightMm && (
            <div
              role="group"
              aria-label="Orientation"
              className="mt-1 inline-flex self-start rounded-full bg-white p-1 ring-1 ring-graphite-200"
            >
              {(['portrait', 'landscape'] as const).map((o) => (
                <button
                  key={o}
                  type="button"
                  aria-pressed={orientation === o}
                  onClick={() => setOrientation(o)}
                  className={cx(
                    'rounded-full px-3 py-1 text-sm font-semibold',
                    orientation === o ? 'bg-graphite-900 text-white' : 'text-graphite-700',
                  )}
                >
                  {o === 'portrait' ? 'Portrait' : 'Landscape'}
                </button>
              ))}
            </div>
          )}
        </fieldset>

        <fieldset className="flex flex-col gap-3">
          <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">2. Photo</legend>
          <PhotoDrop studioSlug={studio.slug} hasPhoto={Boolean(photo)} onPhoto={choosePhoto} />
          {verdict && ppi !== undefined && (
            <div
              role="status"
              className={cx(
                'rounded-lg border px-4 py-3 text-sm',
                verdict === 'good'
                  ? 'border-moss-600 bg-moss-100 text-moss-800'
                  : verdict === 'fair'
                    ? 'border-ember-300 bg-ember-50 text-ember-800'
                    : 'border-rust-600 bg-rust-100 text-rust-800',
              )}
            >
              <p className="font-bold">
                {verdict === 'good' ? 'Good resolution' : verdict === 'fair' ? 'Fair resolution' : 'Resolution too low'}: {Math.floor(ppi)}{' '}
                pixels per inch at {formatSize(area.widthMm, area.heightMm, studio.units)}
              </p>
              <p>
                {verdict === 'good' && 'Plenty of detail for a crisp engraving.'}
                {verdict === 'fair' && 'It will engrave well; a larger photo would be sharper still.'}
                {verdict === 'too-low' &&
                  (fairer
                    ? `Choose ${fairer.label} or upload a larger photo.`
                    : 'Please upload a larger photo: this one has too few pixels for any size offered.')}
              </p>
            </div>
          )}
          {photo?.quality.blurry && (
            <Notice tone="caution">This photo looks blurred: the engraving will look soft. A sharper photo gives a better result.</Notice>
          )}
          {photo && photo.quality.exposure !== 'ok' && (
            <Notice tone="caution">
              {photo.quality.exposure === 'dark'
                ? 'Much of this photo is very dark; detail in the shadows will be lost.'
                : 'Much of this photo is very bright; detail in the highlights will be lost.'}
            </Notice>
          )}
          {verdict === 'too-low' && !refused && (
            <label className="flex items-start gap-2 text-sm">
              <input
                type="checkbox"
                checked={lowConfirmed}
                onChange={(e) => setLowConfirmed(e.target.checked)}
                className="mt-1 accent-[var(--color-accent)]"
              />
              Engrave it at this size anyway: I understand it will look soft.
            </label>
          )}
          {refused && <Notice tone="error">This studio does not engrave photos this small at this size.</Notice>}
        </fieldset>

        {photo && framing ? (
          <fieldset className="flex flex-col gap-3">
            <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">3. Placement</legend>
            <label className="flex flex-col gap-1 text-sm font-semibold">
              <span className="flex justify-between">
                <span>Zoom</span>
                <span className="font-normal text-graphite-600">{framing.zoom.toFixed(2)}×</span>
              </span>
              <input
                type="range"
                aria-label="Zoom"
                min={1}
                max={MAX_ZOOM}
                step={0.01}
                value={framing.zoom}
                onChange={(e) => frame((f) => ({ ...f, zoom: Number(e.target.value) }))}
                className="accent-[var(--color-accent)]"
              />
            </label>
            {/* Quarter turns and fine straightening are kept apart: the slider moves only the last ±15°. */}
            <label className="flex flex-col gap-1 text-sm font-semibold">
              <span className="flex justify-between">
                <span>Straighten</span>
                <span className="font-normal text-graphite-600">{formatDegrees(straightening(framing.rotation))}</span>
              </span>
              <input
                type="range"
                aria-label="Straighten"
                min={-MAX_STRAIGHTEN}
                max={MAX_STRAIGHTEN}
                step={0.5}
                value={straightening(framing.rotation)}
                onChange={(e) => frame((f) => ({ ...f, rotation: quarterTurnsOf(f.rotation) * 90 + Number(e.target.value) }))}
                className="accent-[var(--color-accent)]"
              />
            </label>
            <div className="flex flex-wrap gap-2">
              <Button size="sm" variant="secondary" onClick={() => frame((f) => ({ ...f, rotation: turned(f.rotation, -90) }))}>
                Turn left
              </Button>
              <Button size="sm" variant="secondary" onClick={() => frame((f) => ({ ...f, rotation: turned(f.rotation, 90) }))}>
                Turn right
              </Button>
              <Button size="sm" variant="secondary" aria-pressed={framing.flip} onClick={() => frame((f) => ({ ...f, flip: !f.flip }))}>
                Mirror
              </Button>
              <Button
                size="sm"
                variant="secondary"
                aria-pressed={framing.mode === 'fill'}
                onClick={() => frame((f) => ({ ...startFraming(photo, 'fill'), rotation: f.rotation, flip: f.flip }))}
              >
                Fill the area
              </Button>
              <Button
                size="sm"
                variant="secondary"
                aria-pressed={framing.mode === 'fit'}
                onClick={() => frame((f) => ({ ...startFraming(photo, 'fit'), rotation: f.rotation, flip: f.flip }))}
              >
                Show it all
              </Button>
            </div>
          </fieldset>
        ) : (
          <fieldset disabled aria-describedby="placement-waits" className="flex flex-col gap-2 opacity-60">
            <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">3. Placement</legend>
            <p id="placement-waits" className="text-sm text-graphite-600">
              Choose a photo first; then move, zoom, turn and straighten it here.
            </p>
          </fieldset>
        )}

        <fieldset className="flex flex-col gap-3">
          <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">4. Words (optional)</legend>
          <label className="flex items-center gap-2 text-sm">
            <input
              type="checkbox"
              checked={inscription.on}
              onChange={(e) => setInscription({ ...inscription, on: e.target.checked })}
              className="accent-[var(--color-accent)]"
            />
            Add a line of text under the photo
          </label>
          {inscription.on && (
            <div className="flex flex-col gap-2">
              {[0, 1].map((i) => (
                <label key={i} className="flex flex-col gap-1 text-sm font-semibold">
                  {i === 0 ? 'First line' : 'Second line (optional)'}
                  <input
                    value={inscription.lines[i] ?? ''}
                    maxLength={40}
                    onChange={(e) => {
                      const lines = [...inscription.lines];
                      lines[i] = e.target.value;
                      setInscription({ ...inscription, lines });
                    }}
                    className="h-10 rounded-lg border border-graphite-200 px-3 font-normal"
                  />
                </label>
              ))}
              <div className="flex gap-3">
                <label className="flex flex-1 flex-col gap-1 text-sm font-semibold">
                  Lettering
                  <select
                    value={inscription.font}
                    onChange={(e) => setInscription({ ...inscription, font: e.target.value as Inscription['font'] })}
                    className="h-10 rounded-lg border border-graphite-200 px-2 font-normal"
                  >
                    {Object.entries(INSCRIPTION_FONTS).map(([value, label]) => (
                      <option key={value} value={value}>
                        {label}
                      </option>
                    ))}
                  </select>
                </label>
                <label className="flex flex-1 flex-col gap-1 text-sm font-semibold">
                  Size
                  <input
                    type="range"
                    min={0.04}
                    max={0.2}
                    step={0.005}
                    value={inscription.size}
                    onChange={(e) => setInscription({ ...inscription, size: Number(e.target.value) })}
                    className="accent-[var(--color-accent)]"
                  />
                </label>
              </div>
            </div>
          )}
        </fieldset>

        <div className="flex flex-col gap-3 border-t border-graphite-100 pt-4">
          <label className="flex items-start gap-2 text-sm">
            <input
              type="checkbox"
              checked={rights}
              onChange={(e) => setRights(e.target.checked)}
              className="mt-1 accent-[var(--color-accent)]"
            />
            I took this photo or have permission to use it.
          </label>
          <div className="flex items-end gap-3">
            <label className="flex w-24 flex-col gap-1 text-sm font-semibold">
              Quantity
              <input
                type="number"
                min={1}
                max={20}
                value={quantity}
                onChange={(e) => setQuantity(Math.min(20, Math.max(1, Number(e.target.value) || 1)))}
                className="h-10 rounded-lg border border-graphite-200 px-3 font-normal"
              />
            </label>
            <Button size="lg" className="flex-1" onClick={addToCart} disabled={size.stock === 'sold-out' || refused}>
              Add to cart · {formatMoney(size.priceMinor * quantity, studio.currency)}
            </Button>
          </div>
          {tried && problems.length > 0 && (
            <Notice tone="error">
              <ul className="list-disc pl-5">
                {problems.map((p) => (
                  <li key={p}>{p}</li>
                ))}
              </ul>
            </Notice>
          )}
        </div>
      </div>
    </section>
  );
}
