import type { Verdict } from '#shared/imaging/photo-checks.ts';
import type { BuyerPhotoView } from '#shared/schemas/photos.ts';
import { formatSize, type LengthUnit } from '#shared/units.ts';
import { Notice } from '#src/components/ui/notice.tsx';
import { cx } from '#src/lib/cx.ts';
import { PhotoDrop } from './photo-drop.tsx';

/**
 * Step 2: the photo, and at once what its pixels give at this size (pixels per inch and a
 * verdict), blur and exposure warnings, and the buyer's confirmation when the studio lets a
 * too-small photo through.
 */
export function PhotoStep({
  studioSlug,
  units,
  area,
  photo,
  check,
  lowConfirmed,
  onLowConfirmed,
  onPhoto,
}: {
  studioSlug: string;
  units: LengthUnit;
  area: { widthMm: number; heightMm: number };
  photo: BuyerPhotoView | undefined;
  check: { ppi: number; verdict: Verdict; fairer?: { label: string }; refused: boolean } | undefined;
  lowConfirmed: boolean;
  onLowConfirmed(confirmed: boolean): void;
  onPhoto(photo: BuyerPhotoView): void;
}) {
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">2. Photo</legend>
      <PhotoDrop studioSlug={studioSlug} hasPhoto={Boolean(photo)} onPhoto={onPhoto} />
      {check && (
        <div
          role="status"
          className={cx(
            'rounded-lg border px-4 py-3 text-sm',
            check.verdict === 'good'
              ? 'border-moss-600 bg-moss-100 text-moss-800'
              : check.verdict === 'fair'
                ? 'border-ember-300 bg-ember-50 text-ember-800'
                : 'border-rust-600 bg-rust-100 text-rust-800',
          )}
        >
          <p className="font-bold">
            {check.verdict === 'good' ? 'Good resolution' : check.verdict === 'fair' ? 'Fair resolution' : 'Resolution too low'}:{' '}
            {Math.floor(check.ppi)} pixels per inch at {formatSize(area.widthMm, area.heightMm, units)}
          </p>
          <p>
            {check.verdict === 'good' && 'Plenty of detail for a crisp engraving.'}
            {check.verdict === 'fair' && 'It will engrave well; a larger photo would be sharper still.'}
            {check.verdict === 'too-low' &&
              (check.fairer
                ? `Choose ${check.fairer.label} or upload a larger photo.`
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
      {check?.verdict === 'too-low' && !check.refused && (
        <label className="flex items-start gap-2 text-sm">
          <input
            type="checkbox"
            checked={lowConfirmed}
            onChange={(e) => onLowConfirmed(e.target.checked)}
            className="mt-0.5 size-6 shrink-0 accent-[var(--color-accent)]"
          />
          Engrave it at this size anyway: I understand it will look soft.
        </label>
      )}
      {check?.refused && <Notice tone="error">This studio does not engrave photos this small at this size.</Notice>}
    </fieldset>
  );
}
