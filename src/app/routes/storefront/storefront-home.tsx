import type { CSSProperties } from 'react';
import { useParams } from 'react-router-dom';
import { usePublicStudio } from '../../../features/storefront/api/get-studio.ts';
import { useStorefrontCatalog } from '../../../features/storefront/api/get-catalog.ts';
import { BlankList } from '../../../features/storefront/components/blank-list.tsx';
import { Notice } from '../../../components/ui/notice.tsx';
import { NotFoundPage } from '../not-found.tsx';
import { AppError } from '../../../../shared/errors.ts';

/** A studio's storefront home, in the studio's own colour. */
export function StorefrontHomePage() {
  const { studioSlug = '' } = useParams();
  const studio = usePublicStudio(studioSlug);
  const catalog = useStorefrontCatalog(studioSlug);

  if (studio.isPending) return <p className="p-10 text-graphite-500">Opening the storefront…</p>;
  if (studio.error) {
    if (studio.error instanceof AppError && studio.error.code === 'NOT_FOUND') return <NotFoundPage />;
    return (
      <div className="mx-auto max-w-xl p-10">
        <Notice tone="error" title="The storefront could not be opened">
          {studio.error.message}
        </Notice>
      </div>
    );
  }

  const { name, accentColour, status, units } = studio.data;
  return (
    <div style={{ '--color-accent': accentColour } as CSSProperties} className="min-h-screen">
      <header className="border-b-4 border-accent bg-white">
        <div className="mx-auto flex h-20 max-w-6xl items-center px-6">
          <h1 className="text-2xl font-extrabold text-graphite-950">{name}</h1>
        </div>
      </header>
      <main className="mx-auto max-w-6xl px-6 py-12">
        {status === 'suspended' ? (
          <Notice tone="caution" title="This storefront is closed">
            {name} is not taking orders at the moment. Orders already placed are not affected.
          </Notice>
        ) : (
          <section aria-labelledby="for-sale">
            <h2 id="for-sale" className="mb-6 text-xl font-bold">
              Photo engraving by {name}
            </h2>
            {catalog.isPending && <p className="text-graphite-500">Loading what this studio makes…</p>}
            {catalog.error && <Notice tone="error">{catalog.error.message}</Notice>}
            {catalog.data && catalog.data.blanks.length === 0 && <p className="text-graphite-600">This studio has nothing for sale yet. Please come back soon.</p>}
            {catalog.data && catalog.data.blanks.length > 0 && <BlankList blanks={catalog.data.blanks} units={units} />}
          </section>
        )}
      </main>
      <footer className="py-6 text-center text-xs text-graphite-500">Storefront powered by Etchwell</footer>
    </div>
  );
}
