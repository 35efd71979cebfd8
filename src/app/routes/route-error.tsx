import { isRouteErrorResponse, Link, useRouteError } from 'react-router-dom';
import { buttonClasses } from '#src/components/ui/button.tsx';
import { Notice } from '#src/components/ui/notice.tsx';

/** What went wrong, in words: a route's answer, our own error, or anything else thrown. */
function describe(error: unknown): string {
  if (isRouteErrorResponse(error)) return `${error.status} ${error.statusText}`.trim();
  if (error instanceof Error) {
    // A page's code that could not be fetched: almost always a new release since the page opened.
    if (/dynamically imported module|Importing a module script failed/i.test(error.message))
      return 'A newer version of Etchwell is out. Reload the page to get it.';
    return error.message;
  }
  return 'Something unexpected happened.';
}

/**
 * The error element of a section's pages: shown inside the section's frame when a page fails to
 * load or to draw, so the header and navigation stay usable.
 */
export function PageError() {
  const error = useRouteError();
  return (
    <div className="mx-auto max-w-xl py-10">
      <Notice tone="error" title="This page could not be shown">
        {describe(error)}
      </Notice>
      <button type="button" className={`${buttonClasses('secondary')} mt-6`} onClick={() => window.location.reload()}>
        Reload the page
      </button>
    </div>
  );
}

/** The error element of a whole section, when its frame itself fails: no frame to keep. */
export function SectionError() {
  const error = useRouteError();
  return (
    <main className="mx-auto max-w-xl px-6 py-24">
      <Notice tone="error" title="Something went wrong">
        {describe(error)}
      </Notice>
      <div className="mt-6 flex flex-wrap gap-3">
        <button type="button" className={buttonClasses('primary')} onClick={() => window.location.reload()}>
          Reload the page
        </button>
        <Link to="/" className={buttonClasses('secondary')}>
          Back to the start
        </Link>
      </div>
    </main>
  );
}

/** Shown while the first page's code loads, before the app has drawn anything. */
export function PageLoading() {
  return <p className="p-10 text-graphite-500">Loading…</p>;
}
