import { Link } from 'react-router-dom';
import { SiteLayout } from '#src/app/layouts/site-layout.tsx';
import { buttonClasses } from '#src/components/ui/button.tsx';

export function NotFoundPage() {
  return (
    <SiteLayout>
      <section className="mx-auto max-w-xl px-6 py-24 text-center">
        <p className="text-sm font-bold uppercase tracking-widest text-ember-600">Not found</p>
        <h1 className="mt-2 text-3xl font-extrabold">There is nothing at this address</h1>
        <p className="mt-3 text-graphite-600">The link may be mistyped, or the page has moved.</p>
        <Link to="/" className={`${buttonClasses('secondary')} mt-8`}>
          Back to the start
        </Link>
      </section>
    </SiteLayout>
  );
}
