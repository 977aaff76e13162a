import request from 'supertest';
import { beforeAll, describe, expect, it } from 'vitest';
import { addDays, daysBetween, localDateOf } from '@shared/domain/shop-time';
import { apiErrorSchema } from '@shared/schemas/errors';
import { planningResponseSchema } from '@shared/schemas/planning';
import { shopSettingsSchema } from '@shared/schemas/settings';
import { todayResponseSchema } from '@shared/schemas/today';
import { createTestApp } from '../setup/test-app';
import { signedInAgent } from '../setup/test-users';
import { createLot, createPaidRoastedOrder, createTestUser } from '../factories/index';

const app = createTestApp();
let staff: Awaited<ReturnType<typeof signedInAgent>>;
let customer: Awaited<ReturnType<typeof signedInAgent>>;
let today: string;

beforeAll(async () => {
  staff = await signedInAgent(app, await createTestUser('staff'));
  customer = await signedInAgent(app, await createTestUser('customer'));
  const settings = shopSettingsSchema.parse((await staff.get('/api/roastery/settings')).body);
  today = localDateOf(new Date(), settings.timeZone);
});

describe('GET /api/roastery/planning', () => {
  it('puts a paid order still to roast on its week, runs the lot out on its roast day, and reorders a lead time before it', async () => {
    // 1,000 g in stock; 4 × 12 oz at medium is 4 × 341 = 1,364 g roasted, more green than that whatever the loss and overage.
    const lot = await createLot({ stockGrams: 1000 });
    const buyer = await createTestUser('customer');
    const roastDate = addDays(today, 20);
    await createPaidRoastedOrder({ userId: buyer.id, roastDate, lines: [{ lotId: lot.id, size: '12oz', quantity: 4, roastLevel: 'medium' }] });
    expect((await staff.patch(`/api/lots/${lot.code}`).send({ supplierLeadTimeDays: 10 })).status).toBe(200);

    const response = await staff.get('/api/roastery/planning?weeks=8');
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const plan = planningResponseSchema.parse(response.body);
    const lotPlan = plan.lots.find((each) => each.lotCode === lot.code)!;
    expect(lotPlan.weeks).toHaveLength(8);
    const week = Math.floor(daysBetween(plan.from, roastDate) / 7);
    expect(lotPlan.weeks[week]!.roastGreenGrams).toBeGreaterThan(1364);
    expect(lotPlan.needGrams).toBe(lotPlan.weeks[week]!.roastGreenGrams);
    expect(lotPlan.runOutDate).toBe(roastDate);
    expect(lotPlan.reorderBy).toBe(addDays(roastDate, -10));
    expect(lotPlan.reorderNow).toBe(false);
    expect(lotPlan.reorderAlert).toBe(false);

    // Twenty days' lead time: the reorder-by day is today, so the order is due now and the lot is flagged.
    expect((await staff.patch(`/api/lots/${lot.code}`).send({ supplierLeadTimeDays: 20 })).status).toBe(200);
    const later = planningResponseSchema.parse((await staff.get('/api/roastery/planning')).body).lots.find((each) => each.lotCode === lot.code)!;
    expect(later.reorderBy).toBe(today);
    expect(later.reorderNow).toBe(true);
    expect(later.reorderAlert).toBe(true);

    const csv = await staff.get('/api/roastery/planning.csv?weeks=8');
    expect(csv.status).toBe(200);
    expect(csv.text.split('\n')[0]).toBe(
      'lot_code,lot_name,week_start,roast_green_grams,sales_green_grams,need_grams,stock_after_grams,run_out_date,supplier_lead_time_days,reorder_by',
    );
    expect(csv.text.split('\n').filter((line) => line.startsWith(`${lot.code},`))).toHaveLength(8);
  });

  it('a supplier lead time is whole days from 0 to 365', async () => {
    const lot = await createLot();
    for (const supplierLeadTimeDays of [-1, 366, 2.5, 'soon']) {
      const response = await staff.patch(`/api/lots/${lot.code}`).send({ supplierLeadTimeDays });
      expect(response.status, String(supplierLeadTimeDays)).toBe(400);
      expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {})).toEqual(['supplierLeadTimeDays']);
    }
  });

  it('when weeks is out of range, then 400 naming the field; customers get 403', async () => {
    const response = await staff.get('/api/roastery/planning?weeks=27');
    expect(response.status).toBe(400);
    expect(Object.keys(apiErrorSchema.parse(response.body).error.fields ?? {})).toEqual(['weeks']);
    expect((await customer.get('/api/roastery/planning')).status).toBe(403);
    expect((await request(app).get('/api/roastery/planning')).status).toBe(401);
  });
});

describe('GET /api/roastery/today', () => {
  it('names the next open roast day and lists a lot at its reorder point', async () => {
    const lot = await createLot({ stockGrams: 2000, reorderPointGrams: 5000 });
    const response = await staff.get('/api/roastery/today');
    expect(response.status, JSON.stringify(response.body)).toBe(200);
    const overview = todayResponseSchema.parse(response.body);
    expect(overview.today).toBe(today);
    if (overview.nextRoastDay) {
      expect(overview.nextRoastDay.date >= overview.today).toBe(true);
      expect(overview.nextRoastDay.isToday).toBe(overview.nextRoastDay.date === overview.today);
    }
    expect(overview.stuck.awaitingPaymentHours).toBe(24);
    expect(overview.reorder).toContainEqual(expect.objectContaining({ lotCode: lot.code, stockGrams: 2000, reorderPointGrams: 5000 }));
  });

  it('is for staff: customers get 403', async () => {
    expect((await customer.get('/api/roastery/today')).status).toBe(403);
  });
});
