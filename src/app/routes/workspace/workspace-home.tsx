import { useParams } from 'react-router-dom';
import { usePublicStudio } from '../../../features/storefront/api/get-studio.ts';
import { RequireSignIn } from './require-sign-in.tsx';

/** The entry of a studio's workspace. */
export function WorkspaceHomePage() {
  const { studioSlug = '' } = useParams();
  return (
    <RequireSignIn>
      <WorkspaceHome slug={studioSlug} />
    </RequireSignIn>
  );
}

function WorkspaceHome({ slug }: { slug: string }) {
  const studio = usePublicStudio(slug);
  return (
    <div className="mx-auto max-w-6xl px-6 py-10">
      <p className="text-sm font-bold uppercase tracking-widest text-ember-600">Workspace</p>
      <h1 className="mt-1 text-3xl font-extrabold">{studio.data?.name ?? slug}</h1>
    </div>
  );
}
