import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { effectivePpi, largestFairOffered, verdictFor } from '#shared/imaging/photo-checks.ts';
import { orientedArea } from '#shared/imaging/sizing.ts';
import { formatMoney } from '#shared/money.ts';
import { storefrontPaths } from '#shared/routes.ts';
import type { StorefrontCatalog } from '#shared/schemas/catalog.ts';
import type { BuyerPhotoView } from '#shared/schemas/photos.ts';
import type { PublicStudio } from '#shared/studio.ts';
import { Button } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useToast } from '#src/components/ui/toast.tsx';
import { useCart } from '#src/features/cart/index.ts';
import { useSessionState } from '#src/lib/use-session-state.ts';
import { useFraming } from '../use-framing.ts';
import { DesignerStage, type View } from './designer-stage.tsx';
import { PhotoStep } from './photo-step.tsx';
import { PlacementStep } from './placement-step.tsx';
import { naturalOrientation, SizeStep, type Orientation } from './size-step.tsx';
import { WordsStep, type InscriptionDraft } from './words-step.tsx';

type Blank = StorefrontCatalog['blanks'][number];

/**
 * The storefront designer: the stage on one side, the steps on the other (size, photo,
 * placement, words, then quantity and the cart). It holds the buyer's choices; each step shows
 * and changes its own.
 */
export function Designer({ studio, blank }: { studio: PublicStudio; blank: Blank }) {
  const cart = useCart(studio.slug);
  const toast = useToast();
  const navigate = useNavigate();
  const available = blank.sizes.filter((s) => s.stock !== 'sold-out');
  // The design so far is kept for the tab, so a reload (or a slip of the thumb) loses nothing.
  const keepAs = `etchwell-design:${studio.slug}:${blank.id}`;
  const [sizeId, setSizeId] = useSessionState(`${keepAs}:size`, available[0]?.id ?? blank.sizes[0]?.id ?? '');
  const size = blank.sizes.find((s) => s.id === sizeId) ?? blank.sizes[0]!;
  const [orientation, setOrientation] = useSessionState<Orientation>(`${keepAs}:orientation`, naturalOrientation(size));
  const [view, setView] = useState<View>('burn');
  const [inscription, setInscription] = useState<InscriptionDraft>({ on: false, lines: [''], font: 'rounded', size: 0.07 });
  const [rights, setRights] = useState(false);
  const [lowConfirmed, setLowConfirmed] = useState(false);
  const [quantity, setQuantity] = useState(1);
  const [tried, setTried] = useState(false);

  const area = orientedArea(size, orientation);
  const framing = useFraming(area.widthMm / area.heightMm, keepAs);
  const { photo, placement } = framing;
  function choosePhoto(next: BuyerPhotoView) {
    framing.choose(next);
    setLowConfirmed(false);
  }

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
    navigate(storefrontPaths.cart(studio.slug));
  }

  return (
    <section aria-labelledby="designer-title" className="grid grid-cols-[minmax(0,1fr)] gap-8 lg:grid-cols-[minmax(0,1fr)_minmax(0,26rem)]">
      <h2 id="designer-title" className="sr-only">
        Design your {blank.name}
      </h2>
      <DesignerStage
        blank={blank}
        units={studio.units}
        area={area}
        framing={framing}
        inscription={inscription}
        view={view}
        onView={setView}
      />

      <div className="flex min-w-0 flex-col gap-6">
        <SizeStep
          sizes={blank.sizes}
          size={size}
          orientation={orientation}
          onSize={(s) => {
            setSizeId(s.id);
            setOrientation(s.orientation === 'either' ? orientation : naturalOrientation(s));
          }}
          onOrientation={setOrientation}
        />
        <PhotoStep
          studioSlug={studio.slug}
          units={studio.units}
          area={area}
          photo={photo}
          check={ppi !== undefined && verdict ? { ppi, verdict, fairer, refused } : undefined}
          lowConfirmed={lowConfirmed}
          onLowConfirmed={setLowConfirmed}
          onPhoto={choosePhoto}
        />
        <PlacementStep framing={framing} />
        <WordsStep inscription={inscription} onChange={setInscription} />

        <div className="flex flex-col gap-3 border-t border-graphite-100 pt-4">
          <label className="flex items-start gap-2 text-sm">
            <input
              type="checkbox"
              checked={rights}
              onChange={(e) => setRights(e.target.checked)}
              className="mt-0.5 size-6 shrink-0 accent-[var(--color-accent)]"
            />
            I took this photo or have permission to use it.
          </label>
          {tried && photo && !rights && (
            <p id="rights-needed" role="alert" className="-mt-2 pl-8 text-sm font-semibold text-rust-600">
              Tick this to confirm you may use the photo.
            </p>
          )}
          <div className="flex flex-wrap items-end gap-3">
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
            <Button size="lg" className="min-w-48 flex-1" onClick={addToCart} disabled={size.stock === 'sold-out' || refused}>
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
