import type { CSSProperties, ReactNode } from 'react';
import { Link, Outlet, useOutletContext, useParams } from 'react-router-dom';
import { AppError } from '#shared/errors.ts';
import type { PublicStudio } from '#shared/studio.ts';
import { usePublicStudio } from '#src/features/storefront/api/get-studio.ts';
import { useCart } from '#src/features/cart/cart-store.ts';
import { NotFoundPage } from '#src/app/routes/not-found.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { usePageTitle } from './page-title.ts';

/**
 * The layout route of a studio's storefront: its name and colour, the cart, and the closed notice
 * when suspended. Its pages render in the outlet and read the studio with `WithStorefront`.
 */
export function StorefrontLayout() {
  const { studioSlug = '' } = useParams();
  const studio = usePublicStudio(studioSlug);
  const cart = useCart(studioSlug);
  usePageTitle(studio.data?.name);

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
  const { name, accentColour, status } = studio.data;
  return (
    <div style={{ '--color-accent': accentColour } as CSSProperties} className="flex min-h-screen flex-col">
      <header className="border-b-4 border-accent bg-white">
        <div className="mx-auto flex h-20 max-w-6xl items-center justify-between gap-4 px-6">
          <Link to={`/s/${studioSlug}`} className="flex items-center gap-3 text-2xl font-extrabold text-graphite-950">
            {studio.data.logoUrl && <img src={studio.data.logoUrl} alt="" className="h-12 max-w-40 object-contain" />}
            {name}
          </Link>
          {status === 'active' && (
            <Link
              to={`/s/${studioSlug}/cart`}
              className="rounded-full px-4 py-2 font-bold text-graphite-800 ring-1 ring-inset ring-graphite-200 hover:bg-birch-100"
            >
              Cart{cart.count > 0 && <span className="ml-2 rounded-full bg-accent px-2 py-0.5 text-sm text-white">{cart.count}</span>}
            </Link>
          )}
        </div>
      </header>
      <main className="mx-auto w-full max-w-6xl flex-1 px-6 py-10">
        {status === 'suspended' ? (
          <Notice tone="caution" title="This storefront is closed">
            {name} is not taking orders at the moment. Orders already placed are not affected.
          </Notice>
        ) : (
          <Outlet context={studio.data} />
        )}
      </main>
      <footer className="py-6 text-center text-xs text-graphite-500">Storefront powered by Etchwell</footer>
    </div>
  );
}

/** A storefront page's access to the studio its layout route loaded. */
export function WithStorefront({ children }: { children: (studio: PublicStudio) => ReactNode }) {
  return <>{children(useOutletContext<PublicStudio>())}</>;
}
