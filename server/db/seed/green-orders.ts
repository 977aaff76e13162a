// One-time green orders (invented customers and baskets): a little history, and the past week's
// orders, the newest awaiting payment or shipping next, the oldest shipped.
import type { EmailPayloads } from '../../../emails/index';
import { demoTrackingUrl } from './shop';
import type { BagSize, OrderStatus } from '../../../shared/domain/vocabulary';
import type * as schema from '../schema/index';
import { demoLots, type DemoLot } from './demo-lots';
import type { ScenarioContext } from './scenario-context';
import { CURRENCY, FILL_GRAMS, FREE_SHIPPING_FROM_CENTS, GREEN_SHIPPING_CENTS, HOUR_MS, localDate, type Insert } from './scenario-values';

type GreenPlan = { userId: string; hoursAgo: number; basket: [string, BagSize, number][]; status?: OrderStatus };

const priceFor = (lot: DemoLot, lineGrams: number) =>
  lot.priceBreaks.reduce((price, [minGrams, breakPrice]) => (lineGrams >= minGrams ? Math.min(price, breakPrice) : price), lot.pricePerKgCents);

function greenOrderPlans({ rng, accounts }: ScenarioContext): GreenPlan[] {
  const { demoCustomerId, customerIds } = accounts;
  const sellable = demoLots.filter((l) => l.stockGrams > 5_000).map((l) => l.code);
  const plans: GreenPlan[] = [
    // Order history: the demo customer's first order (the lots of their Roast Journal) and an old sell-out.
    {
      userId: demoCustomerId,
      hoursAgo: 35 * 24 + 5,
      basket: [
        ['WR-24-ETH-01', '1lb', 1],
        ['WR-24-BRA-01', '2lb', 1],
        ['WR-24-GTM-01', '1lb', 1],
      ],
    },
    { userId: customerIds[3] as string, hoursAgo: 20 * 24 + 3, basket: [['WR-24-KEN-01', '5lb', 2]] },
    {
      userId: customerIds[8] as string,
      hoursAgo: 26 * 24 + 7,
      basket: [
        ['WR-24-KEN-01', '5lb', 1],
        ['WR-24-CRI-01', '2lb', 1],
      ],
    },
    {
      userId: demoCustomerId,
      hoursAgo: 60,
      basket: [
        ['WR-25-RWA-01', '1lb', 1],
        ['WR-24-CRI-01', '8oz', 1],
      ],
    },
  ];
  // Placed over the past week: the newest are awaiting payment or ship next, the oldest have shipped.
  const recentHours = [2, 3, 5, 7, 9, 13, 17, 22, 30, 41, 52, 64, 75, 88, 99, 112, 124, 137, 150, 163];
  const pendingAt = new Set([1, 6, 7]);
  recentHours.forEach((hoursAgo, n) => {
    const userId = rng.pick(customerIds.slice(1));
    const lines = rng.int(1, 3);
    const basket: [string, BagSize, number][] = [];
    for (let l = 0; l < lines; l += 1) {
      const code = rng.pick(sellable);
      if (basket.some(([c]) => c === code)) continue;
      basket.push([code, rng.pick(['8oz', '1lb', '1lb', '2lb', '5lb'] as const), rng.pick([1, 1, 2])]);
    }
    plans.push({ userId, hoursAgo, basket, status: pendingAt.has(n) ? 'pending_payment' : n === 12 ? 'refunded' : undefined });
  });
  return plans;
}

export function demoGreenOrders(ctx: ScenarioContext) {
  const { rng, clock, settings, cal, accounts, catalogue, outbox } = ctx;
  const { now } = clock;
  const { today } = cal;
  const { lotId } = catalogue;
  const orders: Insert<typeof schema.orders>[] = [];
  const orderItems: Insert<typeof schema.orderItems>[] = [];
  const stockMovements: Insert<typeof schema.stockMovements>[] = [];
  for (const plan of greenOrderPlans(ctx)) {
    const id = rng.uuid();
    const createdAt = new Date(Math.floor(now.getTime() / 60_000) * 60_000 - plan.hoursAgo * HOUR_MS);
    const pending = plan.status === 'pending_payment';
    const paidAt = pending ? null : new Date(createdAt.getTime() + 2 * 60_000);
    const paidDate = paidAt ? localDate(paidAt, settings.timeZone) : null;
    const shipDate = paidDate ? cal.nextShipDay(paidDate) : null;
    let status: OrderStatus = plan.status ?? 'paid';
    if (!plan.status && shipDate) {
      if (shipDate < today) status = 'shipped';
      else if (shipDate === today && cal.clock >= `${today} 09:30`) status = 'packed';
    }
    const packedAt = shipDate && (status === 'shipped' || status === 'packed') ? cal.at(shipDate, '09:30') : null;
    const shippedAt = shipDate && status === 'shipped' ? cal.at(shipDate, '16:00') : null;
    const refundedAt = status === 'refunded' && paidAt ? new Date(paidAt.getTime() + 20 * HOUR_MS) : null;
    let subtotalCents = 0;
    const emailLines: EmailPayloads['order-confirmed']['lines'] = [];
    for (const [code, size, quantity] of plan.basket) {
      const lot = catalogue.lotByCode(code);
      const fillGrams = FILL_GRAMS[size];
      const unitPriceCents = Math.round((fillGrams * priceFor(lot, fillGrams * quantity)) / 1000);
      subtotalCents += unitPriceCents * quantity;
      emailLines.push({ description: lot.name, size, quantity, lineTotalCents: unitPriceCents * quantity });
      orderItems.push({
        id: rng.uuid(),
        orderId: id,
        lotId: lotId(code),
        kind: 'green',
        size,
        quantity,
        fillGrams,
        unitPriceCents,
        lineTotalCents: unitPriceCents * quantity,
      });
      // Stock is taken when checkout reserves it (pending included) and returned on a refund.
      stockMovements.push({ id: rng.uuid(), lotId: lotId(code), deltaGrams: -fillGrams * quantity, reason: 'sale', note: '', orderId: id, createdAt });
      if (refundedAt)
        stockMovements.push({
          id: rng.uuid(),
          lotId: lotId(code),
          deltaGrams: fillGrams * quantity,
          reason: 'refund',
          note: 'Refunded before packing (invented)',
          orderId: id,
          actorId: accounts.ownerId,
          createdAt: refundedAt,
        });
    }
    const shippingCents = subtotalCents >= FREE_SHIPPING_FROM_CENTS ? 0 : GREEN_SHIPPING_CENTS;
    const totalCents = subtotalCents + shippingCents;
    const shippingAddress = accounts.addressOf(plan.userId);
    const orderShipDate = status === 'refunded' ? null : shipDate;
    // Drawn in the row's column order, so the PRNG sequence (and every demo value after it) is unchanged.
    const shipment = shippedAt
      ? { shippedAt, carrier: rng.pick(['Kestrel Post', 'Larkspur Freight']), trackingNumber: `WR-DEMO-${rng.hex(5).toUpperCase()}` }
      : null;
    orders.push({
      id,
      userId: plan.userId,
      kind: 'green',
      status,
      subtotalCents,
      shippingCents,
      totalCents,
      shippingAddress,
      shipDate: orderShipDate,
      carrier: shipment?.carrier ?? null,
      trackingNumber: shipment?.trackingNumber ?? null,
      stripeCheckoutSessionId: `cs_test_demo_${rng.hex(12)}`,
      stripePaymentIntentId: paidAt ? `pi_demo_${rng.hex(8)}` : null,
      paidAt,
      packedAt,
      shippedAt,
      refundedCents: refundedAt ? totalCents : 0,
      refundedAt,
      createdAt,
      updatedAt: refundedAt ?? shippedAt ?? packedAt ?? paidAt ?? createdAt,
    });
    const name = accounts.nameOf(plan.userId);
    if (paidAt) {
      outbox.queue(
        'order-confirmed',
        plan.userId,
        id,
        {
          name,
          orderId: id,
          kind: 'green',
          lines: emailLines,
          subtotalCents,
          shippingCents,
          totalCents,
          currency: CURRENCY,
          shipTo: shippingAddress,
          ...(orderShipDate ? { shipDate: orderShipDate } : {}),
        },
        paidAt,
      );
    }
    if (shipment) {
      const { carrier, trackingNumber } = shipment;
      outbox.queue(
        'shipped',
        plan.userId,
        id,
        { name, orderId: id, kind: 'green', carrier, trackingNumber, trackingUrl: demoTrackingUrl(carrier, trackingNumber) },
        shipment.shippedAt,
      );
    }
  }
  return { orders, orderItems, stockMovements };
}
