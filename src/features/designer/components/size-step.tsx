import type { StorefrontCatalog } from '#shared/schemas/catalog.ts';
import { cx } from '#src/lib/cx.ts';

type Size = StorefrontCatalog['blanks'][number]['sizes'][number];
export type Orientation = 'portrait' | 'landscape';

/** A size's own way round; "either" follows its area's longer side. */
export const naturalOrientation = (size: Size): Orientation =>
  size.orientation === 'landscape'
    ? 'landscape'
    : size.orientation === 'portrait'
      ? 'portrait'
      : size.areaWidthMm > size.areaHeightMm
        ? 'landscape'
        : 'portrait';

/** Step 1: the size, with its price and stock, and portrait or landscape where the size allows both. */
export function SizeStep({
  sizes,
  size,
  orientation,
  onSize,
  onOrientation,
}: {
  sizes: Size[];
  size: Size;
  orientation: Orientation;
  onSize(size: Size): void;
  onOrientation(orientation: Orientation): void;
}) {
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-2 text-sm font-bold uppercase tracking-wide text-graphite-600">1. Size</legend>
      {sizes.map((s) => (
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
              onChange={() => onSize(s)}
              className="size-6 accent-[var(--color-accent)]"
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
              onClick={() => onOrientation(o)}
              className={cx(
                'min-h-9 rounded-full px-3 py-1 text-sm font-semibold',
                orientation === o ? 'bg-graphite-900 text-white' : 'text-graphite-700',
              )}
            >
              {o === 'portrait' ? 'Portrait' : 'Landscape'}
            </button>
          ))}
        </div>
      )}
    </fieldset>
  );
}
