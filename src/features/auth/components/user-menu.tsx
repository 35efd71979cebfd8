import { Link, useNavigate } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { useMe } from '../api/get-me.ts';
import { signOut } from '../api/sign-in.ts';
import { useToast } from '#src/components/ui/toast.tsx';

/** The header's sign-in link, or who is signed in with their studios and a sign-out button. */
export function UserMenu() {
  const me = useMe();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  const toast = useToast();
  const user = me.data?.user;
  if (!user) {
    return (
      <nav aria-label="Account" className="flex items-center gap-1">
        <Link to="/open-a-studio" className="rounded-lg px-3 py-2 text-sm font-semibold text-graphite-700 hover:bg-graphite-100">
          Open a studio
        </Link>
        <Link to="/sign-in" className="rounded-lg px-3 py-2 text-sm font-semibold text-graphite-700 hover:bg-graphite-100">
          Sign in
        </Link>
      </nav>
    );
  }
  async function onSignOut() {
    try {
      await signOut();
      queryClient.clear();
      navigate('/');
    } catch (error) {
      toast.show((error as Error).message, 'error');
    }
  }
  return (
    <nav aria-label="Account" className="flex flex-wrap items-center gap-1 text-sm">
      {me.data!.memberships.map((m) => (
        <Link
          key={m.studioSlug}
          to={`/studio/${m.studioSlug}`}
          className="rounded-lg px-3 py-2 font-semibold text-graphite-700 hover:bg-graphite-100"
        >
          {m.studioName}
        </Link>
      ))}
      {user.isPlatformAdmin && (
        <Link to="/platform/studios" className="rounded-lg px-3 py-2 font-semibold text-graphite-700 hover:bg-graphite-100">
          Platform
        </Link>
      )}
      <Link to="/account/orders" className="rounded-lg px-3 py-2 font-semibold text-graphite-700 hover:bg-graphite-100">
        My orders
      </Link>
      <span className="hidden px-2 text-graphite-500 sm:inline">{user.name ?? user.email}</span>
      <button type="button" onClick={onSignOut} className="rounded-lg px-3 py-2 font-semibold text-graphite-700 hover:bg-graphite-100">
        Sign out
      </button>
    </nav>
  );
}
