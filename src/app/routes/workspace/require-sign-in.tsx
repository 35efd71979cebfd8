import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { useMe } from '#src/features/auth/api/get-me.ts';

/**
 * Pages for signed-in people. Anyone else goes to the sign-in page, which brings them back here
 * afterwards. The server checks again on every call: this only spares a detour.
 */
export function RequireSignIn({ children }: { children: ReactNode }) {
  const me = useMe();
  const location = useLocation();
  if (me.isPending) return <p className="p-10 text-graphite-500">Checking your sign-in…</p>;
  if (!me.data?.user) {
    const next = `${location.pathname}${location.search}`;
    return <Navigate to={`/sign-in?next=${encodeURIComponent(next)}`} replace />;
  }
  return <>{children}</>;
}
