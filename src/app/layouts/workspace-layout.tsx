import type { ReactNode } from 'react';
import { NavLink, Outlet, useOutletContext, useParams } from 'react-router-dom';
import { can, ROLE_LABELS } from '#shared/permissions.ts';
import { AppError } from '#shared/errors.ts';
import { useWorkspace, type Workspace } from '#src/features/workspace/api/get-workspace.ts';
import { UserMenu } from '#src/features/auth/components/user-menu.tsx';
import { RequireSignIn } from '#src/app/routes/workspace/require-sign-in.tsx';
import { Notice } from '#src/components/ui/notice.tsx';
import { cx } from '#src/lib/cx.ts';
import { usePageTitle } from './page-title.ts';

/**
 * The layout route of a studio's workspace: studio name, the pages this member may open, and the
 * account menu. Its pages render in the outlet and read the workspace with `WithWorkspace`.
 */
export function WorkspaceLayout() {
  return (
    <RequireSignIn>
      <WorkspaceFrame />
    </RequireSignIn>
  );
}

/** A workspace page's access to the studio and role its layout route loaded. */
export function WithWorkspace({ children }: { children: (workspace: Workspace) => ReactNode }) {
  return <>{children(useOutletContext<Workspace>())}</>;
}

function WorkspaceFrame() {
  const { studioSlug = '' } = useParams();
  const workspace = useWorkspace(studioSlug);
  usePageTitle(workspace.data && `${workspace.data.studio.name} workspace`);
  const nav = [
    { to: `/studio/${studioSlug}`, label: 'Overview', end: true, show: true },
    { to: `/studio/${studioSlug}/orders`, label: 'Orders', end: false, show: can(workspace.data?.role, 'order:read') },
    { to: `/studio/${studioSlug}/review`, label: 'Photo review', end: false, show: can(workspace.data?.role, 'order:review') },
    { to: `/studio/${studioSlug}/prep`, label: 'Prep', end: false, show: can(workspace.data?.role, 'order:read') },
    { to: `/studio/${studioSlug}/production`, label: 'Production', end: false, show: can(workspace.data?.role, 'order:read') },
    { to: `/studio/${studioSlug}/catalog`, label: 'Catalog', end: false, show: can(workspace.data?.role, 'catalog:read') },
    { to: `/studio/${studioSlug}/team`, label: 'Team', end: false, show: can(workspace.data?.role, 'team:manage') },
    { to: `/studio/${studioSlug}/settings`, label: 'Settings', end: false, show: can(workspace.data?.role, 'studio:settings') },
    { to: `/studio/${studioSlug}/audit`, label: 'Audit log', end: false, show: can(workspace.data?.role, 'audit:read') },
  ];
  return (
    <div className="min-h-screen">
      <header className="border-b border-graphite-100 bg-white">
        <div className="mx-auto flex min-h-16 max-w-6xl flex-wrap items-center justify-between gap-x-4 gap-y-1 px-6 py-2">
          <div className="flex items-center gap-3">
            <img src="/favicon.svg" alt="" className="size-7" />
            <span className="text-lg font-extrabold">{workspace.data?.studio.name ?? 'Workspace'}</span>
            {workspace.data && (
              <span className="rounded-full bg-birch-100 px-2 py-0.5 text-xs font-bold text-graphite-600">
                {ROLE_LABELS[workspace.data.role]}
              </span>
            )}
          </div>
          <UserMenu />
        </div>
        {/* On a phone the sections scroll sideways inside the bar, not the page. */}
        <nav aria-label="Workspace" className="mx-auto flex max-w-6xl gap-1 overflow-x-auto px-6">
          {nav
            .filter((item) => item.show)
            .map((item) => (
              <NavLink
                key={item.to}
                to={item.to}
                end={item.end}
                className={({ isActive }) =>
                  cx(
                    'shrink-0 whitespace-nowrap border-b-2 px-3 py-2.5 text-sm font-semibold',
                    isActive ? 'border-ember-500 text-graphite-950' : 'border-transparent text-graphite-500 hover:text-graphite-800',
                  )
                }
              >
                {item.label}
              </NavLink>
            ))}
        </nav>
      </header>
      <main className="mx-auto max-w-6xl px-6 py-8">
        {workspace.isPending && <p className="text-graphite-500">Opening the workspace…</p>}
        {workspace.error && (
          <Notice tone="error" title="This workspace could not be opened">
            {workspace.error instanceof AppError && workspace.error.code === 'NOT_FOUND'
              ? 'There is no studio at this address, or you are not a member of it.'
              : workspace.error.message}
          </Notice>
        )}
        {workspace.data && <Outlet context={workspace.data} />}
      </main>
    </div>
  );
}
