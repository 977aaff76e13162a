import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { dayCapacityGrams, isOpenRoastDay } from '@shared/domain/roast-schedule';
import { addDays } from '@shared/domain/shop-time';
import { roastLevels } from '@shared/domain/vocabulary';
import { defaultShopSettings, type ShopSettings } from '@shared/schemas/settings';
import { planClosureMoves, type OrderOnClosedDay } from '../../server/modules/roastery/calendar-planning';

// Monday, Wednesday and Friday roast; 2031-05-07 is a Wednesday. A day takes 12 kg of green: more
// than the largest order generated below (3 lines × 3 × 908 g at up to 25 % loss ≈ 11.1 kg).
const settings: ShopSettings = { ...defaultShopSettings, roastWeekdays: ['mon', 'wed', 'fri'], dayCapacityGrams: 12_000 };
const closedDate = '2031-05-07';
const overrides = { [closedDate]: { open: false } };

const orderArbitrary = fc.record({
  customer: fc.constantFrom('a@example.test', 'b@example.test', 'c@example.test'),
  paidAtMs: fc.integer({ min: Date.UTC(2031, 3, 1), max: Date.UTC(2031, 4, 6) }),
  lines: fc.array(
    fc.record({
      roastLevel: fc.constantFrom(...roastLevels),
      brewMethod: fc.constantFrom('filter' as const, 'espresso' as const),
      fillGrams: fc.constantFrom(341, 454, 908),
      quantity: fc.integer({ min: 1, max: 3 }),
    }),
    { minLength: 1, maxLength: 3 },
  ),
});

describe('planClosureMoves', () => {
  it('moves every order to a later open roast day without filling any day past its capacity, and mails each customer once', () => {
    fc.assert(
      fc.property(fc.array(orderArbitrary, { minLength: 1, maxLength: 25 }), (drafts) => {
        const orders: OrderOnClosedDay[] = drafts.map((draft, index) => ({
          id: `00000000-0000-4000-8000-${String(index).padStart(12, '0')}`,
          customer: { email: draft.customer, name: 'Invented' },
          paidAt: new Date(draft.paidAtMs),
          deliveryId: null,
          lines: draft.lines.map((line) => ({ ...line, coffee: 'Invented Lot' })),
        }));
        const plan = planClosureMoves({ closedDate, orders, deliveries: [], settings, overrides, plannedGreenGrams: { '2031-05-09': 1_000 } });

        expect(plan.orders).toHaveLength(orders.length);
        const load: Record<string, number> = { '2031-05-09': 1_000 };
        for (const move of plan.orders) {
          const { roastDate } = move.dates;
          expect(roastDate > closedDate).toBe(true);
          expect(isOpenRoastDay(roastDate, settings, { overrides })).toBe(true);
          expect(move.dates.shipDate >= roastDate && move.dates.readyFrom >= roastDate).toBe(true);
          expect(move.dates.bestBefore).toBe(addDays(roastDate, settings.bestBeforeDays));
          const order = orders.find((candidate) => candidate.id === move.id)!;
          load[roastDate] = (load[roastDate] ?? 0) + order.lines.reduce((total, line) => total + line.fillGrams * line.quantity, 0);
        }
        // Roasted grams stay under green grams, so the roasted load bounds the green load from below.
        for (const [date, roasted] of Object.entries(load)) expect(roasted).toBeLessThanOrEqual(dayCapacityGrams(date, settings, { overrides }));

        const customers = new Set(orders.map((order) => order.customer.email));
        expect(plan.emails.map((email) => email.to).sort()).toEqual([...customers].sort());
        expect(plan.emails.reduce((total, email) => total + email.payload.items.length, 0)).toBe(orders.length);
        expect(new Set(plan.emails.map((email) => email.dedupeKey)).size).toBe(plan.emails.length);
      }),
    );
  });

  it('keeps a later-paid order from taking a place an earlier-paid one needed', () => {
    const order = (id: string, paidAt: string, quantity: number): OrderOnClosedDay => ({
      id,
      customer: { email: `${id}@example.test`, name: 'Invented' },
      paidAt: new Date(paidAt),
      deliveryId: null,
      lines: [{ coffee: 'Invented Lot', roastLevel: 'medium', brewMethod: 'filter', fillGrams: 454, quantity }],
    });
    // 8 × 454 g at medium 15 % and 2 % overage: ceil(3,632 × 1.02 ÷ 0.85) = ceil(4,358.4) = 4,359 g:
    // one such order fits a 5,000 g day, two do not.
    const plan = planClosureMoves({
      closedDate,
      orders: [order('later', '2031-05-05T12:00:00Z', 8), order('earlier', '2031-05-01T12:00:00Z', 8)],
      deliveries: [],
      settings: { ...settings, dayCapacityGrams: 5_000 },
      overrides,
      plannedGreenGrams: {},
    });
    expect(Object.fromEntries(plan.orders.map((move) => [move.id, move.dates.roastDate]))).toEqual({ earlier: '2031-05-09', later: '2031-05-12' });
  });
});
