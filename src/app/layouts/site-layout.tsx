import type { ReactNode } from 'react';
import { Link, Outlet } from 'react-router-dom';
import { UserMenu } from '#src/features/auth/components/user-menu.tsx';
import { usePageTitle } from './page-title.ts';

/**
 * Etchwell's own pages (home, sign-in, not found): the platform header and footer. The layout
 * route of those pages (its outlet shows the page), or a frame around `children`.
 */
export function SiteLayout({ children }: { children?: ReactNode }) {
  usePageTitle('Etchwell');
  return (
    <div className="flex min-h-screen flex-col">
      <header className="border-b border-graphite-100 bg-white/80 backdrop-blur">
        <div className="mx-auto flex h-16 max-w-6xl items-center justify-between gap-4 px-6">
          <Link to="/" className="flex items-center gap-2 text-lg font-extrabold text-graphite-900">
            <img src="/favicon.svg" alt="" className="size-7" />
            Etchwell
          </Link>
          <UserMenu />
        </div>
      </header>
      <main className="flex-1">{children ?? <Outlet />}</main>
      <footer className="border-t border-graphite-100 py-6 text-center text-xs text-graphite-500">
        Etchwell — photo engraving, from the buyer&rsquo;s phone to the laser.
      </footer>
    </div>
  );
}
