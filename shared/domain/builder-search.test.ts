import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { builderSearchKeys, rotationSearchValue, searchFromBuilder } from './builder-search';
import { brewMethods, grinds, roastedBagSizes, roastLevels } from './vocabulary';

describe('searchFromBuilder', () => {
  it('carries every choice under its own key, the Roaster’s Rotation as "rotation"', () => {
    const search = searchFromBuilder({
      lotCode: null,
      roastLevel: 'medium',
      bagSize: '1lb',
      bagsPerDelivery: 2,
      grind: 'drip',
      brewMethod: 'filter',
      cadenceWeeks: 3,
    });
    expect(search.toString()).toBe(`lot=${rotationSearchValue}&level=medium&size=1lb&bags=2&grind=drip&brew=filter&every=3`);
  });

  it('leaves out what is not chosen yet, and a bag count that is not a number', () => {
    expect(searchFromBuilder({ roastLevel: 'dark', bagsPerDelivery: Number.NaN }).toString()).toBe('lot=rotation&level=dark');
  });

  it('reads back every full choice it writes (property)', () => {
    fc.assert(
      fc.property(
        fc.record({
          lotCode: fc.option(fc.stringMatching(/^[A-Z0-9-]{1,12}$/), { nil: null }),
          roastLevel: fc.constantFrom(...roastLevels),
          bagSize: fc.constantFrom(...roastedBagSizes),
          bagsPerDelivery: fc.integer({ min: 1, max: 6 }),
          grind: fc.constantFrom(...grinds),
          brewMethod: fc.constantFrom(...brewMethods),
          cadenceWeeks: fc.integer({ min: 1, max: 4 }),
        }),
        (choice) => {
          const search = searchFromBuilder(choice);
          expect(search.get(builderSearchKeys.lotCode)).toBe(choice.lotCode ?? rotationSearchValue);
          expect(search.get(builderSearchKeys.grind)).toBe(choice.grind);
          expect(Number(search.get(builderSearchKeys.bagsPerDelivery))).toBe(choice.bagsPerDelivery);
          expect(Number(search.get(builderSearchKeys.cadenceWeeks))).toBe(choice.cadenceWeeks);
        },
      ),
    );
  });
});
