import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { grindMismatch } from './grind-fit';
import { brewMethods, grinds } from './vocabulary';

describe('grindMismatch', () => {
  it('takes whole bean for any brew method: the subscriber grinds it (common practice)', () => {
    fc.assert(fc.property(fc.constantFrom(...brewMethods), (method) => grindMismatch(method, 'whole-bean') === null));
  });

  it('asks about an espresso or moka grind for filter brewing, such as a French press (too fine for filter and immersion: common practice)', () => {
    expect(grindMismatch('filter', 'espresso')).toMatch(/too fine for filter/);
    expect(grindMismatch('filter', 'moka-pot')).toMatch(/too fine/);
  });

  it('asks about coarse filter grinds for espresso: French press, cold brew, drip and pour-over (too coarse: common practice)', () => {
    for (const grind of ['french-press', 'cold-brew', 'drip', 'pour-over'] as const)
      expect(grindMismatch('espresso', grind), grind).toMatch(/too coarse for espresso/);
  });

  it('takes the grinds made for each method, and a hand press for both (fine to medium: common practice)', () => {
    for (const grind of ['pour-over', 'drip', 'french-press', 'cold-brew', 'hand-press'] as const) expect(grindMismatch('filter', grind), grind).toBeNull();
    for (const grind of ['espresso', 'moka-pot', 'hand-press'] as const) expect(grindMismatch('espresso', grind), grind).toBeNull();
  });

  it('finds every grind but whole bean and the hand press unsuited to exactly one method', () => {
    for (const grind of grinds) {
      const misfits = brewMethods.filter((method) => grindMismatch(method, grind) !== null).length;
      expect(misfits, grind).toBe(grind === 'whole-bean' || grind === 'hand-press' ? 0 : 1);
    }
  });
});
