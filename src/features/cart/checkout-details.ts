/**
 * What the buyer typed at checkout (address, name, delivery), kept for this tab only, so that
 * coming back from the payment page with "back to the shop" finds the form as it was left. Kept
 * in sessionStorage: gone when the tab closes, and cleared once the order is paid.
 */
const key = (slug: string) => `etchwell-checkout:${slug}`;

type Plain = Record<string, unknown>;
const isPlain = (value: unknown): value is Plain => typeof value === 'object' && value !== null && !Array.isArray(value);

/** Saved values laid over the defaults, field by field; anything not of the defaults' shape is ignored. */
function overlay<T>(defaults: T, saved: unknown): T {
  if (!isPlain(defaults) || !isPlain(saved)) return typeof saved === typeof defaults ? (saved as T) : defaults;
  const out: Plain = { ...defaults };
  for (const [name, value] of Object.entries(defaults)) if (name in saved) out[name] = overlay(value, saved[name]);
  return out as T;
}

export function loadCheckoutDetails<T>(slug: string, defaults: T): T {
  try {
    const raw = sessionStorage.getItem(key(slug));
    return raw ? overlay(defaults, JSON.parse(raw)) : defaults;
  } catch {
    return defaults;
  }
}

export function saveCheckoutDetails(slug: string, values: unknown): void {
  try {
    sessionStorage.setItem(key(slug), JSON.stringify(values));
  } catch {
    // Storage full or refused (private browsing): the form still works, it is only not kept.
  }
}

export function clearCheckoutDetails(slug: string): void {
  try {
    sessionStorage.removeItem(key(slug));
  } catch {
    // Nothing kept, nothing to clear.
  }
}
