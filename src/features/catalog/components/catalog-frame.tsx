import type { ReactNode } from 'react';
import { NavLink } from 'react-router-dom';
import { cx } from '#src/lib/cx.ts';
import { Notice } from '#src/components/ui/notice.tsx';

/** The catalog's own tabs, its page title and, for those who may only look, a note saying so. */
export function CatalogFrame({
  slug,
  title,
  canEdit,
  actions,
  children,
}: {
  slug: string;
  title: string;
  canEdit: boolean;
  actions?: ReactNode;
  children: ReactNode;
}) {
  const tabs = [
    { to: `/studio/${slug}/catalog/blanks`, label: 'Blanks' },
    { to: `/studio/${slug}/catalog/materials`, label: 'Materials' },
    { to: `/studio/${slug}/catalog/machines`, label: 'Machines' },
    { to: `/studio/${slug}/catalog/recipes`, label: 'Recipes' },
  ];
  return (
    <div className="flex flex-col gap-6">
      <nav aria-label="Catalog" className="flex flex-wrap gap-2">
        {tabs.map((tab) => (
          <NavLink
            key={tab.to}
            to={tab.to}
            className={({ isActive }) =>
              cx(
                'rounded-full px-4 py-1.5 text-sm font-bold',
                isActive
                  ? 'bg-graphite-900 text-white'
                  : 'bg-white text-graphite-700 ring-1 ring-inset ring-graphite-200 hover:bg-birch-100',
              )
            }
          >
            {tab.label}
          </NavLink>
        ))}
      </nav>
      <div className="flex flex-wrap items-center justify-between gap-4">
        <h1 className="text-3xl font-extrabold">{title}</h1>
        {canEdit && actions}
      </div>
      {!canEdit && <Notice>You can look through the catalog. Only the studio’s owners can change it.</Notice>}
      {children}
    </div>
  );
}

/** What a list shows while it loads or when it failed. */
export function QueryState({ isPending, error }: { isPending: boolean; error: Error | null }) {
  if (error)
    return (
      <Notice tone="error" title="This list could not be loaded">
        {error.message}
      </Notice>
    );
  if (isPending) return <p className="text-graphite-500">Loading…</p>;
  return null;
}
