// @vitest-environment happy-dom
import { afterEach, describe, expect, it } from 'vitest';
import { maxBagsPerLine, maxLinesPerOrder } from '@shared/schemas/checkout';
import { cartStore, type CartLine } from './cart-store';

// An invented lot.
const line: CartLine = { lotCode: 'RD-T01', lotName: 'Test Ridge Washed', size: '1lb', quantity: 1, pricePerKgCents: 2450, priceBreaks: [] };

afterEach(() => window.localStorage.clear());

describe('cart store', () => {
  it('joins bags of the same lot and size into one line, and keeps other sizes apart', () => {
    cartStore.add(line);
    cartStore.add({ ...line, quantity: 2 });
    cartStore.add({ ...line, size: '5lb' });
    expect(cartStore.getSnapshot().map((each) => [each.size, each.quantity])).toEqual([
      ['1lb', 3],
      ['5lb', 1],
    ]);
  });

  it('keeps a line between 1 and the most bags one line takes', () => {
    cartStore.add({ ...line, quantity: maxBagsPerLine });
    cartStore.add(line);
    expect(cartStore.getSnapshot()[0]?.quantity).toBe(maxBagsPerLine);
    cartStore.setQuantity(line, 0);
    expect(cartStore.getSnapshot()[0]?.quantity).toBe(1);
  });

  it('refuses a line past the most one order takes', () => {
    for (let index = 0; index < maxLinesPerOrder; index += 1) expect(cartStore.add({ ...line, lotCode: `RD-T${index}` })).toBe(true);
    expect(cartStore.add({ ...line, lotCode: 'RD-MORE' })).toBe(false);
    expect(cartStore.getSnapshot()).toHaveLength(maxLinesPerOrder);
  });

  it('tells subscribers of each change and forgets the storage entry when emptied', () => {
    let calls = 0;
    const unsubscribe = cartStore.subscribe(() => (calls += 1));
    cartStore.add(line);
    cartStore.remove(line);
    unsubscribe();
    expect(calls).toBe(2);
    expect(window.localStorage.getItem('restday.cart')).toBeNull();
  });

  it('starts empty when what is stored is not a cart', () => {
    window.localStorage.setItem('restday.cart', '{"version":1,"lines":[{"lotCode":"RD-T01"}]}');
    expect(cartStore.getSnapshot()).toEqual([]);
    window.localStorage.setItem('restday.cart', 'not json');
    expect(cartStore.getSnapshot()).toEqual([]);
  });
});
