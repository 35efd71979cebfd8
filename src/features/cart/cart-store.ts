import { useMemo, useSyncExternalStore } from 'react';
import { z } from 'zod';
import { cartItemSchema } from '#shared/schemas/checkout.ts';

/**
 * A buyer's cart for one studio, kept in the browser (it survives a reload and needs no
 * account). Each line holds what checkout sends, plus what the cart shows; prices shown here
 * are for display only: the server prices the order again from the catalog.
 */
export const cartLineSchema = cartItemSchema.extend({
  lineId: z.string(),
  blankName: z.string(),
  sizeLabel: z.string(),
  priceMinor: z.number().int(),
  thumbUrl: z.string(),
  verdict: z.enum(['good', 'fair', 'too-low']),
});
export type CartLine = z.input<typeof cartLineSchema>;

const key = (slug: string) => `etchwell-cart:${slug}`;
const listeners = new Set<() => void>();
const cache = new Map<string, { raw: string | null; lines: CartLine[] }>();

function read(slug: string): CartLine[] {
  const raw = localStorage.getItem(key(slug));
  const cached = cache.get(slug);
  if (cached && cached.raw === raw) return cached.lines;
  let lines: CartLine[];
  try {
    const parsed = z.array(cartLineSchema).safeParse(raw ? JSON.parse(raw) : []);
    lines = parsed.success ? (parsed.data as CartLine[]) : [];
  } catch {
    lines = [];
  }
  cache.set(slug, { raw, lines });
  return lines;
}

function write(slug: string, lines: CartLine[]): void {
  localStorage.setItem(key(slug), JSON.stringify(lines));
  for (const listener of listeners) listener();
}

const subscribe = (listener: () => void) => {
  listeners.add(listener);
  const onStorage = (event: StorageEvent) => event.key?.startsWith('etchwell-cart:') && listener();
  window.addEventListener('storage', onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener('storage', onStorage);
  };
};

/** The cart outside React: every change goes through these, and `useCart` shows them. */
export const cartStore = {
  lines: read,
  count: (slug: string) => read(slug).reduce((n, l) => n + (l.quantity ?? 1), 0),
  add: (slug: string, line: Omit<CartLine, 'lineId'>) => write(slug, [...read(slug), { ...line, lineId: crypto.randomUUID() }]),
  setQuantity: (slug: string, lineId: string, quantity: number) =>
    write(
      slug,
      read(slug).map((l) => (l.lineId === lineId ? { ...l, quantity } : l)),
    ),
  remove: (slug: string, lineId: string) =>
    write(
      slug,
      read(slug).filter((l) => l.lineId !== lineId),
    ),
  clear: (slug: string) => write(slug, []),
  subscribe,
};

/** The studio's cart, kept in step with every tab; its actions stay the same between renders. */
export function useCart(slug: string) {
  const lines = useSyncExternalStore(subscribe, () => read(slug));
  const actions = useMemo(
    () => ({
      add: (line: Omit<CartLine, 'lineId'>) => cartStore.add(slug, line),
      setQuantity: (lineId: string, quantity: number) => cartStore.setQuantity(slug, lineId, quantity),
      remove: (lineId: string) => cartStore.remove(slug, lineId),
      clear: () => cartStore.clear(slug),
    }),
    [slug],
  );
  return { lines, count: lines.reduce((n, l) => n + (l.quantity ?? 1), 0), ...actions };
}
