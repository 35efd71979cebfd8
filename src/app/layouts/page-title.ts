import { useEffect } from 'react';
import { useMatches } from 'react-router-dom';

/** A route's `handle`: the page's own name, shown in the browser's tab and history. */
export type PageHandle = { title: string };

const titleOf = (handle: unknown) =>
  handle && typeof handle === 'object' && 'title' in handle && typeof handle.title === 'string' ? handle.title : undefined;

/**
 * Titles the document after the deepest route that names its page, then `place` (the studio,
 * or Etchwell): "Cart · Harbour Light Engraving". A page without a name is titled by its place.
 */
export function usePageTitle(place: string | undefined) {
  const matches = useMatches();
  const page = [...matches]
    .reverse()
    .map((m) => titleOf(m.handle))
    .find(Boolean);
  useEffect(() => {
    document.title = [page, place ?? 'Etchwell'].filter((part, i, all) => part && all.indexOf(part) === i).join(' · ');
  }, [page, place]);
}
