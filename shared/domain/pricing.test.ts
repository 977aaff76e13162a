import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { defaultShopSettings } from '../schemas/settings';
import { greenBagPrice, pricePerKgFor, quoteGreenOrder, quoteSubscriptionDelivery, subscriptionBagPrices, type Quote, type TaxRule } from './pricing';
import { greenBagSizes, roastedBagSizes } from './vocabulary';

// Restday's default bands (shared/schemas/settings.ts; invented prices, no carrier's): ≤500 g $6.95, ≤1 kg $8.95,
// ≤2 kg $11.95, ≤5 kg $16.95, ≤10 kg $24.95; bag tare 20 g, box tare 180 g.
const shipping = defaultShopSettings.shipping;
const lot = {
  pricePerKgCents: 2200,
  priceBreaks: [
    { minGrams: 2268, pricePerKgCents: 2000 },
    { minGrams: 9072, pricePerKgCents: 1800 },
  ],
};

function expectBalanced(quote: Quote): void {
  expect(quote.totalCents).toBe(quote.lines.reduce((sum, line) => sum + line.amountCents, 0));
  expect(quote.totalCents).toBe(quote.subtotalCents - quote.discountCents + quote.shippingCents + quote.taxCents);
  for (const line of quote.lines) expect(line.amountCents).toBe(line.quantity * line.unitCents);
}

describe('green coffee prices', () => {
  it('prices a bag on its exact declared weight, rounded half-up once', () => {
    // $22.00/kg × 0.45359237 kg (NIST SP 811) = $9.9790… → $9.98
    expect(greenBagPrice('1lb', 2200)).toBe(998);
    // $20.00/kg × 2.26796185 kg = $45.359… → $45.36
    expect(greenBagPrice('5lb', 2000)).toBe(4536);
    // $25.00/kg × 0.226796185 kg = $5.6699… → $5.67
    expect(greenBagPrice('8oz', 2500)).toBe(567);
  });

  it('applies the best quantity break the whole order reaches for that lot', () => {
    expect(pricePerKgFor(1362, lot)).toBe(2200); // 3 × 1 lb fill = 1,362 g: no break
    expect(pricePerKgFor(2270, lot)).toBe(2000); // 5 × 1 lb = 2,270 g ≥ 2,268 g
    expect(pricePerKgFor(9072, lot)).toBe(1800);
    expect(
      pricePerKgFor(9072, {
        pricePerKgCents: 2200,
        priceBreaks: [
          { minGrams: 9072, pricePerKgCents: 1800 },
          { minGrams: 2268, pricePerKgCents: 2000 },
        ],
      }),
    ).toBe(1800);
  });

  it('quotes a green order with shipping and a zero tax line that adds up', () => {
    // 1 × 5 lb + 1 × 1 lb of the same lot: 2,268 + 454 = 2,722 g ≥ 2,268 → $20.00/kg for both.
    // 5 lb: $45.36; 1 lb: $20 × 0.45359237 = $9.0718 → $9.07. Parcel: 2,722 + 2 × 20 + 180 = 2,942 g → ≤ 5 kg band $16.95.
    const quote = quoteGreenOrder(
      [
        { lotCode: 'RD-101', size: '5lb', quantity: 1 },
        { lotCode: 'RD-101', size: '1lb', quantity: 1 },
      ],
      { 'RD-101': lot },
      { shipping },
    );
    expect(quote.subtotalCents).toBe(4536 + 907);
    expect(quote.shippingCents).toBe(1695);
    expect(quote.taxCents).toBe(0);
    expect(quote.totalCents).toBe(4536 + 907 + 1695);
    expect(quote.lines.map((line) => line.kind)).toEqual(['item', 'item', 'shipping', 'tax']);
    expect(quote.shipping.parcels).toEqual([
      {
        bags: [
          { key: 'RD-101, green, 5lb', quantity: 1 },
          { key: 'RD-101, green, 1lb', quantity: 1 },
        ],
        grams: 2942,
        bandMaxGrams: 5000,
        cents: 1695,
      },
    ]);
    expectBalanced(quote);
    expect(() => quoteGreenOrder([{ lotCode: 'RD-999', size: '1lb', quantity: 1 }], {}, { shipping })).toThrow(/no price/);
    expect(() => quoteGreenOrder([{ lotCode: 'RD-101', size: '1lb', quantity: 0 }], { 'RD-101': lot }, { shipping })).toThrow(RangeError);
  });
});

describe('subscription deliveries', () => {
  it('takes the subscription discount as its own line', () => {
    // 2 × 12 oz at $18.00 = $36.00; 10 % off = $3.60; parcel 2 × (341 + 20) + 180 = 902 g → $8.95. Total $41.35.
    const quote = quoteSubscriptionDelivery({ lotCode: null, bagSize: '12oz', bagsPerDelivery: 2 }, defaultShopSettings);
    expect(quote).toMatchObject({ subtotalCents: 3600, discountCents: 360, shippingCents: 895, taxCents: 0, totalCents: 4135 });
    expect(quote.lines[0]?.description).toMatch(/Roaster's Rotation/);
    expectBalanced(quote);
    const noDiscount = quoteSubscriptionDelivery(
      { lotCode: 'RD-101', bagSize: '1lb', bagsPerDelivery: 1 },
      { ...defaultShopSettings, subscriptionDiscountPct: 0 },
    );
    expect(noDiscount.lines.map((line) => line.kind)).toEqual(['item', 'shipping', 'tax']);
  });

  it('lets a tax rule plug in, and the total still equals the sum of its lines', () => {
    const flatTax: TaxRule = ({ lines }) => Math.round(lines.filter((line) => line.kind === 'item').reduce((sum, line) => sum + line.amountCents, 0) * 0.05);
    fc.assert(
      fc.property(
        fc.constantFrom(...roastedBagSizes),
        fc.integer({ min: 1, max: 6 }),
        fc.integer({ min: 0, max: 5000 }).map((hundredths) => hundredths / 100),
        (bagSize, bags, discountPct) => {
          const quote = quoteSubscriptionDelivery(
            { lotCode: 'RD-101', bagSize, bagsPerDelivery: bags },
            { ...defaultShopSettings, subscriptionDiscountPct: discountPct },
            flatTax,
          );
          expectBalanced(quote);
          expect(quote.taxCents).toBe(Math.round(quote.subtotalCents * 0.05));
        },
      ),
    );
  });

  it('balances any green order', () => {
    const item = fc.record({ lotCode: fc.constantFrom('RD-101', 'RD-102'), size: fc.constantFrom(...greenBagSizes), quantity: fc.integer({ min: 1, max: 8 }) });
    fc.assert(
      fc.property(fc.array(item, { minLength: 1, maxLength: 6 }), (items) => {
        expectBalanced(quoteGreenOrder(items, { 'RD-101': lot, 'RD-102': { pricePerKgCents: 3100, priceBreaks: [] } }, { shipping }));
      }),
    );
  });
});

describe('subscriptionBagPrices', () => {
  it('prices one bag of each size less the subscription discount, rounded half up to the cent', () => {
    // $18.00 less 10 % = $16.20; $23.00 less 10 % = $20.70; $44.00 less 10 % = $39.60 (Restday's
    // invented default prices). At 12.5 %: $18.00 × 0.125 = $2.25 → $15.75; $23.00 × 0.125 =
    // $2.875 → $2.88 (halves up) → $20.12.
    const prices = { '12oz': 1_800, '1lb': 2_300, '2lb': 4_400 };
    expect(subscriptionBagPrices({ roastedBagPriceCents: prices, subscriptionDiscountPct: 10 })).toEqual({ '12oz': 1_620, '1lb': 2_070, '2lb': 3_960 });
    expect(subscriptionBagPrices({ roastedBagPriceCents: prices, subscriptionDiscountPct: 12.5 })).toMatchObject({ '12oz': 1_575, '1lb': 2_012 });
  });
});
