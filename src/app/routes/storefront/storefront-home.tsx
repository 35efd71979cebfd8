import { useParams } from 'react-router-dom';
import { WithStorefront } from '#src/app/layouts/storefront-layout.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { useStorefrontCatalog } from '#src/features/storefront/api/get-catalog.ts';
import { BlankList } from '#src/features/storefront/components/blank-list.tsx';

/** A studio's storefront home: what it makes, each leading to its designer. */
export function StorefrontHomePage() {
  const { studioSlug = '' } = useParams();
  const catalog = useStorefrontCatalog(studioSlug);
  return (
    <WithStorefront>
      {({ name, units }) => (
        <section aria-labelledby="for-sale">
          <h1 id="for-sale" className="mb-2 text-3xl font-extrabold">
            Your photo, engraved by {name}
          </h1>
          <p className="mb-8 max-w-2xl text-graphite-600">
            Choose a piece, upload a photo and see how it will look once burned, before you pay.
          </p>
          {catalog.isPending && <p className="text-graphite-500">Loading what this studio makes…</p>}
          {catalog.error && <Notice tone="error">{catalog.error.message}</Notice>}
          {catalog.data && catalog.data.blanks.length === 0 && (
            <p className="text-graphite-600">This studio has nothing for sale yet. Please come back soon.</p>
          )}
          {catalog.data && catalog.data.blanks.length > 0 && (
            <BlankList studioSlug={studioSlug} blanks={catalog.data.blanks} units={units} />
          )}
        </section>
      )}
    </WithStorefront>
  );
}
