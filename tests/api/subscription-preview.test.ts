import request from 'supertest';
import { describe, expect, it } from 'vitest';
import { apiErrorSchema } from '@shared/schemas/errors';
import { subscriptionPreviewSchema } from '@shared/schemas/subscription-preview';
import { eq } from 'drizzle-orm';
import { lots } from '../../server/db/schema/index';
import { createAdjustableClock } from '../../server/lib/clock';
import { createTestApp } from '../setup/test-app';
import { getTestDb } from '../setup/test-db';
import { useCalendarOverrides, useShopSettings } from './subscriber-support';
import { createLotForSale } from '../factories/index';

// The default shop (the product's defaults in defaultShopSettings): New York; roasts Mon, Wed,
// Fri; cutoff 12:00 the day before; ships Mon–Fri after a 1-day degassing hold, 3 transit days,
// ready on arrival and never in transit over a weekend (the default ship policy); filter rests 2 days; best-before 28 days; 12 oz bag $18.00, 10 % subscription discount; shipping bands up to
// 1,000 g $8.95, bag tare 20 g, box tare 180 g.
useShopSettings();
const override = useCalendarOverrides();

// Tue 4 Mar 2031, 10:00 EST (15:00Z): Wednesday's cutoff (Tue 12:00 EST) has not passed.
const clock = createAdjustableClock();
clock.set(new Date('2031-03-04T15:00:00Z'));
const app = createTestApp({ clock });

const choice = { roastLevel: 'medium', bagSize: '12oz', bagsPerDelivery: '2', brewMethod: 'filter', cadenceWeeks: '2' };
const preview = (query: Record<string, string>) => request(app).get('/api/subscriptions/preview').query(query);

describe('GET /api/subscriptions/preview', () => {
  it('prices a delivery with the subscription discount and lists the first three from the Roast Calendar', async () => {
    const lot = await createLotForSale(50_000);
    const response = await preview({ ...choice, lotCode: lot.code });
    expect(response.status).toBe(200);
    expect(subscriptionPreviewSchema.parse(response.body)).toEqual({
      // Bags 2 × $18.00 = $36.00, less 10 % ($3.60) = $32.40. Parcel: 2 × (341 g fill + 20 g tare)
      // + 180 g box = 902 g → the ≤ 1,000 g band, $8.95. Charged each delivery: $41.35.
      priceCents: 4135,
      regularPriceCents: 4495,
      discountPct: 10,
      shippingCents: 895,
      // One bag each, less 10 %: $18.00 → $16.20, $23.00 → $20.70, $44.00 → $39.60 (default prices).
      bagPriceCents: { '12oz': 1620, '1lb': 2070, '2lb': 3960 },
      currency: 'usd',
      shipPolicy: 'ready_on_arrival',
      deliveries: [
        // Wed 5 Mar 2031: ready Fri 7 (filter, 2 days), best-before Wed 2 Apr (+28). Cutoff Tue 4 Mar
        // 12:00 EST = 17:00Z. The hold allows Thu 6, but Thu 6 and Fri 7 would be in transit over
        // 8–9 Mar; Mon 10 → Tue 11, Wed 12, Thu 13 (no federal holiday in March or April 2031).
        {
          roastDate: '2031-03-05',
          shipDate: '2031-03-10',
          readyFrom: '2031-03-07',
          bestBefore: '2031-04-02',
          expectedArrival: '2031-03-13',
          cutoffAt: '2031-03-04T17:00:00.000Z',
        },
        // Two weeks on, Wed 19 Mar. US clocks went forward on Sun 9 Mar 2031 (second Sunday of
        // March), so its cutoff, Tue 18 Mar 12:00 EDT, is 16:00Z. Ships Mon 24, lands Thu 27.
        {
          roastDate: '2031-03-19',
          shipDate: '2031-03-24',
          readyFrom: '2031-03-21',
          bestBefore: '2031-04-16',
          expectedArrival: '2031-03-27',
          cutoffAt: '2031-03-18T16:00:00.000Z',
        },
        // Wed 2 Apr: ships Mon 7, lands Thu 10 Apr.
        {
          roastDate: '2031-04-02',
          shipDate: '2031-04-07',
          readyFrom: '2031-04-04',
          bestBefore: '2031-04-30',
          expectedArrival: '2031-04-10',
          cutoffAt: '2031-04-01T16:00:00.000Z',
        },
      ],
    });
  });

  it("prices the Roaster's Rotation when no lot is given, at any roast level", async () => {
    const response = await preview({ ...choice, roastLevel: 'french', bagsPerDelivery: '1' });
    expect(response.status).toBe(200);
    // One bag: $18.00 − $1.80 = $16.20; parcel 341 + 20 + 180 = 541 g → ≤ 1,000 g band, $8.95.
    expect(subscriptionPreviewSchema.parse(response.body)).toMatchObject({ priceCents: 2515, regularPriceCents: 2695, shippingCents: 895 });
  });

  it('starts on the next roast day until its cutoff, and on the one after from the cutoff on', async () => {
    // Wed 12 Mar 2031's cutoff is Tue 11 Mar 12:00 EDT (clocks went forward on 9 Mar) = 16:00Z.
    const at = async (instant: string) => {
      const atClock = createAdjustableClock();
      atClock.set(new Date(instant));
      const body = subscriptionPreviewSchema.parse(
        (
          await request(createTestApp({ clock: atClock }))
            .get('/api/subscriptions/preview')
            .query(choice)
        ).body,
      );
      return body.deliveries[0]?.roastDate;
    };
    expect(await at('2031-03-11T15:59:00Z')).toBe('2031-03-12');
    // At the cutoff the next open roast day is Fri 14 Mar.
    expect(await at('2031-03-11T16:00:00Z')).toBe('2031-03-14');
  });

  it('moves the first delivery past a closed roast day and a day with no capacity left, and keeps the rest on the grid', async () => {
    await override('2031-03-05', { open: false, note: 'Roaster service' });
    // Friday 7 Mar can roast only 500 g; two 12 oz bags at medium need more green coffee than that
    // (682 g roasted ÷ (1 − 15 %) + 2 % overage ≈ 819 g), so the first roast is Mon 10 Mar.
    await override('2031-03-07', { open: true, capacityGrams: 500 });
    const body = subscriptionPreviewSchema.parse((await preview({ ...choice, cadenceWeeks: '1' })).body);
    expect(body.deliveries.map((delivery) => delivery.roastDate)).toEqual(['2031-03-10', '2031-03-17', '2031-03-24']);
    // Mon 10 Mar: the cutoff is Sun 9 Mar 12:00 EDT (clocks went forward at 02:00 that morning) = 16:00Z.
    expect(body.deliveries[0]).toMatchObject({ shipDate: '2031-03-11', readyFrom: '2031-03-12', cutoffAt: '2031-03-09T16:00:00.000Z' });
  });

  it('answers 400 naming each field that is missing or out of range', async () => {
    const response = await preview({ roastLevel: 'blond', bagSize: '5lb', bagsPerDelivery: '0', brewMethod: 'filter', cadenceWeeks: '6' });
    expect(response.status).toBe(400);
    const { error } = apiErrorSchema.parse(response.body);
    expect(Object.keys(error.fields ?? {}).sort()).toEqual(['bagSize', 'bagsPerDelivery', 'cadenceWeeks', 'roastLevel']);
  });

  it('answers 404 for a lot that does not exist or is not on sale', async () => {
    expect((await preview({ ...choice, lotCode: 'NO-SUCH-LOT' })).status).toBe(404);
    const hidden = await createLotForSale(1000);
    await getTestDb().update(lots).set({ isListed: false }).where(eq(lots.id, hidden.id));
    expect((await preview({ ...choice, lotCode: hidden.code })).status).toBe(404);
  });

  it('answers 422 for a roast level the lot does not allow, naming the field', async () => {
    const lot = await createLotForSale(1000); // allows light and medium
    const response = await preview({ ...choice, lotCode: lot.code, roastLevel: 'dark' });
    expect(response.status).toBe(422);
    const { error } = apiErrorSchema.parse(response.body);
    expect(error.code).toBe('roast_level_not_allowed');
    expect(error.fields).toEqual({ roastLevel: 'Choose one of: light, medium.' });
  });
});
