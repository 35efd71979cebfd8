import { Link, useParams } from 'react-router-dom';
import { formatSize } from '#shared/units.ts';
import { WithStorefront } from '#src/app/layouts/storefront-layout.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { Designer } from '#src/features/designer/components/designer.tsx';
import { useStorefrontCatalog } from '#src/features/storefront/api/get-catalog.ts';

/** One blank: what it is, its sizes and prices, and the designer to order it with a photo. */
export function BlankPage() {
  const { studioSlug = '', blankId = '' } = useParams();
  const catalog = useStorefrontCatalog(studioSlug);
  return (
    <WithStorefront>
      {(studio) => {
        if (catalog.isPending) return <p className="text-graphite-500">Loading…</p>;
        if (catalog.error) return <Notice tone="error">{catalog.error.message}</Notice>;
        const blank = catalog.data.blanks.find((b) => b.id === blankId);
        if (!blank)
          return (
            <Notice tone="caution" title="This piece is not for sale">
              It may have sold out or been withdrawn.{' '}
              <Link to={`/s/${studioSlug}`} className="font-semibold underline">
                See what {studio.name} makes
              </Link>
              .
            </Notice>
          );
        return (
          <div className="flex flex-col gap-8">
            <div className="flex flex-col gap-3">
              <Link
                to={`/s/${studioSlug}`}
                className="inline-block self-start py-1 text-sm font-semibold text-graphite-600 hover:underline"
              >
                ← Everything {studio.name} makes
              </Link>
              <h1 className="text-3xl font-extrabold">{blank.name}</h1>
              <p className="text-graphite-600">{blank.material.name}</p>
              {blank.description && <p className="max-w-3xl text-graphite-800">{blank.description}</p>}
              <details className="max-w-3xl text-sm text-graphite-700">
                <summary className="cursor-pointer font-semibold">Sizes, engraving areas and care</summary>
                <ul className="mt-2 list-disc pl-5">
                  {blank.sizes.map((s) => (
                    <li key={s.id}>
                      {s.label}: engraving area {formatSize(s.areaWidthMm, s.areaHeightMm, studio.units)}, {s.price}
                      {s.stock === 'sold-out' ? ' (sold out)' : s.stock === 'few-left' ? ' (only a few left)' : ''}
                    </li>
                  ))}
                </ul>
                {blank.material.notes && <p className="mt-2">{blank.material.notes}</p>}
              </details>
            </div>
            <Designer studio={studio} blank={blank} />
          </div>
        );
      }}
    </WithStorefront>
  );
}
