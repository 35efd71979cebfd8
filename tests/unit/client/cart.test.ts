import { beforeEach, describe, expect, it } from 'vitest';
import { cartStore, type CartLine } from '#src/features/cart/cart-store.ts';
import { clearCheckoutDetails, loadCheckoutDetails, saveCheckoutDetails } from '#src/features/cart/checkout-details.ts';

/** The Web Storage interface (WHATWG HTML, §12.2) over a Map: what the cart needs of the browser. */
class MemoryStorage implements Storage {
  private items = new Map<string, string>();
  get length() {
    return this.items.size;
  }
  clear() {
    this.items.clear();
  }
  getItem(key: string) {
    return this.items.get(key) ?? null;
  }
  key(index: number) {
    return [...this.items.keys()][index] ?? null;
  }
  removeItem(key: string) {
    this.items.delete(key);
  }
  setItem(key: string, value: string) {
    this.items.set(key, String(value));
  }
}

const line = (over: Partial<CartLine> = {}): Omit<CartLine, 'lineId'> => ({
  blankId: '00000000-0000-4000-8000-000000000001',
  sizeId: '00000000-0000-4000-8000-000000000002',
  orientation: 'portrait',
  quantity: 1,
  photoId: '00000000-0000-4000-8000-000000000003',
  placement: { crop: { left: 0, top: 0, width: 800, height: 1000 }, rotation: 0, flipHorizontal: false },
  rightsConfirmed: true,
  blankName: 'Glass panel',
  sizeLabel: '8 × 10 in',
  priceMinor: 6900,
  thumbUrl: '/thumb',
  verdict: 'good',
  ...over,
});

describe('the cart (kept in the browser, one per studio)', () => {
  beforeEach(() => {
    Object.assign(globalThis, { localStorage: new MemoryStorage(), sessionStorage: new MemoryStorage() });
  });

  it('adds lines with ids of their own, counts quantities, changes and removes one line', () => {
    cartStore.add('harbour-light', line());
    cartStore.add('harbour-light', line({ quantity: 2, blankName: 'Slate coaster' }));
    const [first, second] = cartStore.lines('harbour-light');
    expect(first!.lineId).not.toBe(second!.lineId);
    expect(cartStore.count('harbour-light')).toBe(3);
    cartStore.setQuantity('harbour-light', first!.lineId, 4);
    expect(cartStore.count('harbour-light')).toBe(6);
    cartStore.remove('harbour-light', second!.lineId);
    expect(cartStore.lines('harbour-light').map((l) => l.blankName)).toEqual(['Glass panel']);
  });

  it('keeps each studio’s cart apart, and clearing one leaves the other', () => {
    cartStore.add('harbour-light', line());
    cartStore.add('fernhill-stone', line({ blankName: 'Slate coaster' }));
    cartStore.clear('harbour-light');
    expect(cartStore.lines('harbour-light')).toEqual([]);
    expect(cartStore.lines('fernhill-stone').map((l) => l.blankName)).toEqual(['Slate coaster']);
  });

  it('answers the same array until the cart changes (what useSyncExternalStore needs), and tells subscribers', () => {
    cartStore.add('harbour-light', line());
    expect(cartStore.lines('harbour-light')).toBe(cartStore.lines('harbour-light'));
    let told = 0;
    Object.assign(globalThis, { window: { addEventListener() {}, removeEventListener() {} } });
    const stop = cartStore.subscribe(() => told++);
    cartStore.clear('harbour-light');
    stop();
    cartStore.clear('harbour-light');
    expect(told).toBe(1);
  });

  it('reads a damaged or tampered cart as empty rather than failing', () => {
    localStorage.setItem('etchwell-cart:harbour-light', '{not json');
    expect(cartStore.lines('harbour-light')).toEqual([]);
    localStorage.setItem('etchwell-cart:harbour-light', JSON.stringify([{ ...line(), lineId: 'x', quantity: 'lots' }]));
    expect(cartStore.lines('harbour-light')).toEqual([]);
  });

  it('keeps what was typed at checkout for this tab, over the form’s defaults, until cleared', () => {
    const defaults = { buyer: { email: '', name: '' }, delivery: { method: 'ship', rateId: '' } };
    expect(loadCheckoutDetails('harbour-light', defaults)).toEqual(defaults);
    saveCheckoutDetails('harbour-light', { buyer: { email: 'june@buyers.test', name: 'June' }, delivery: { method: 'pickup' }, extra: 1 });
    expect(loadCheckoutDetails('harbour-light', defaults)).toEqual({
      buyer: { email: 'june@buyers.test', name: 'June' },
      delivery: { method: 'pickup', rateId: '' },
    });
    expect(loadCheckoutDetails('fernhill-stone', defaults)).toEqual(defaults);
    clearCheckoutDetails('harbour-light');
    expect(loadCheckoutDetails('harbour-light', defaults)).toEqual(defaults);
  });
});
