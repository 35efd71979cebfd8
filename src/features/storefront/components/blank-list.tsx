import type { StorefrontCatalog } from '#shared/schemas/catalog.ts';
import { formatSize, type LengthUnit } from '#shared/units.ts';
import { Link } from 'react-router-dom';
import { Card } from '#src/components/ui/card.tsx';
import { buttonClasses } from '#src/components/ui/button.tsx';

const stockWords = { 'in-stock': 'In stock', 'few-left': 'Only a few left', 'sold-out': 'Sold out' } as const;
const shapeRadius = { rectangle: '6px', 'rounded-rectangle': '18px', oval: '50% / 40%', circle: '50%' } as const;

/** The blanks a studio sells, each with its material's colours, sizes and prices. */
export function BlankList({ studioSlug, blanks, units }: { studioSlug: string; blanks: StorefrontCatalog['blanks']; units: LengthUnit }) {
  return (
    <ul className="grid gap-5 sm:grid-cols-2 lg:grid-cols-3">
      {blanks.map((blank) => (
        <li key={blank.id}>
          <Card className="relative flex h-full flex-col gap-4 transition hover:shadow-md">
            {blank.photos[0] ? (
              <img
                src={blank.photos[0].url}
                alt={blank.name}
                width={blank.photos[0].width}
                height={blank.photos[0].height}
                loading="lazy"
                className="-mx-6 -mt-6 aspect-[4/3] w-[calc(100%+3rem)] max-w-none rounded-t-card object-cover"
              />
            ) : (
              <div
                aria-hidden
                className={`mx-auto flex items-center justify-center text-xs font-bold ${blank.shape === 'circle' ? 'h-28 w-28' : 'h-32 w-28'}`}
                style={{
                  background: blank.material.surfaceColour,
                  color: blank.material.markColour,
                  borderRadius: shapeRadius[blank.shape],
                }}
              >
                {blank.material.name.split(' ')[0]}
              </div>
            )}
            <div>
              <h3 className="text-lg font-bold">
                <Link to={`/s/${studioSlug}/blanks/${blank.id}`} className="after:absolute after:inset-0 hover:underline">
                  {blank.name}
                </Link>
              </h3>
              <p className="text-sm text-graphite-500">{blank.material.name}</p>
            </div>
            {blank.description && <p className="text-sm text-graphite-700">{blank.description}</p>}
            <table className="mt-auto w-full text-sm">
              <caption className="sr-only">Sizes and prices of {blank.name}</caption>
              <tbody>
                {blank.sizes.map((s) => (
                  <tr key={s.id} className="border-t border-graphite-100">
                    <th scope="row" className="py-1.5 text-left font-semibold">
                      {s.label}
                      <span className="block text-xs font-normal text-graphite-500">
                        engraving area {formatSize(s.areaWidthMm, s.areaHeightMm, units)}
                      </span>
                    </th>
                    <td className="py-1.5 text-right">
                      <span className="font-bold">{s.price}</span>
                      <span className={`block text-xs ${s.stock === 'sold-out' ? 'text-rust-600' : 'text-graphite-500'}`}>
                        {stockWords[s.stock]}
                      </span>
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
            <span aria-hidden className={buttonClasses('primary', 'md')}>
              Design yours
            </span>
          </Card>
        </li>
      ))}
    </ul>
  );
}
