import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { useSession } from '../../../features/auth/api/get-session.ts';

/**
 * Workspace pages need a signed-in member. Anyone else goes to the sign-in page, which brings
 * them back here afterwards. The server checks again on every call: this only spares a detour.
 */
export function RequireSignIn({ children }: { children: ReactNode }) {
  const session = useSession();
  const location = useLocation();
  if (session.isPending) return <p className="p-10 text-graphite-500">Checking your sign-in…</p>;
  if (!session.data) {
    const next = `${location.pathname}${location.search}`;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return <>{children}</>;
}
