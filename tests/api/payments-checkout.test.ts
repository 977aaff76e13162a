import { randomUUID } from 'node:crypto';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { decliningTestCard, succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { inboxOf, waitFor } from './outbox-support';
import {
  eventsAbout,
  ledgerCount,
  orderRow,
  outboxCount,
  settle,
  startPaymentsServer,
  stripeFake,
  subscriptionRow,
  testPaymentsService,
  testStripe,
  type PaymentsServer,
} from './payments-support';
import { createCustomer, createGreenOrder, createLotForSale, createPendingSubscription } from '../factories/index';

let running: PaymentsServer;
let lot: { id: string; name: string };
let payments: ReturnType<typeof testPaymentsService>;
const stripe = testStripe();
const mailCatcherUrl = inject('mailCatcherUrl');

beforeAll(async () => {
  running = await startPaymentsServer();
  payments = testPaymentsService(running.config);
  lot = await createLotForSale(50_000);
});

afterAll(async () => {
  await running.stop();
});

describe('paying a green order on the test-payment page', () => {
  it('with 4242, the signed webhook marks the order paid and the order-confirmed e-mail reaches the mail catcher', async () => {
    const customer = await createCustomer('pays-4242');
    const order = await createGreenOrder(customer.id, lot.id);
    const { checkoutUrl, checkoutSessionId } = await payments.createCheckoutForOrder(order.id);
    expect(checkoutUrl).toBe(`${inject('stripeFakeUrl')}/test-payment/${checkoutSessionId}`);
    expect((await orderRow(order.id)).stripeCheckoutSessionId).toBe(checkoutSessionId);

    const session = await stripe.checkout.sessions.retrieve(checkoutSessionId, { expand: ['line_items'] });
    expect(session).toMatchObject({ mode: 'payment', amount_total: 4849, currency: 'usd', client_reference_id: order.id, customer_email: customer.email });
    expect(session.line_items?.data.map((item) => [item.description, item.quantity, item.amount_total])).toEqual([
      [`${lot.name}, green coffee, 1 lb`, 1, 1899],
      [`${lot.name}, green coffee, 8 oz`, 2, 2100],
      ['Shipping', 1, 850],
    ]);

    const paid = await payOnTestPaymentPage(checkoutUrl, { number: '4242 4242 4242 4242' });
    expect(paid.status).toBe(303);
    expect(paid.location).toBe(`${running.server.url}/orders/${order.id}?checkout=complete`);

    const row = await waitFor(
      () => orderRow(order.id),
      (current) => current.status === 'paid',
      10_000,
      'the order to be paid',
    );
    expect(row.paidAt).toBeInstanceOf(Date);
    expect(row.stripePaymentIntentId).toMatch(/^pi_/);
    const [completed] = await eventsAbout(checkoutSessionId, 'checkout.session.completed');
    expect(completed?.status).toBe('delivered');
    expect(await ledgerCount([completed!.eventId])).toBe(1);

    const inbox = await waitFor(
      () => inboxOf(mailCatcherUrl, customer.email),
      (mails) => mails.length > 0,
      15_000,
      'the order-confirmed e-mail',
    );
    expect(inbox).toHaveLength(1);
    expect(inbox[0]!.subject).toBe('Your green coffee order is confirmed');
    expect(inbox[0]!.text).toContain('$48.49');
    expect(inbox[0]!.text).toContain(lot.name);
  });

  it('with the declined card 4000 0000 0000 0002, the page says so, the order stays unpaid and no e-mail is sent', async () => {
    const customer = await createCustomer('declined');
    const order = await createGreenOrder(customer.id, lot.id);
    const { checkoutUrl, checkoutSessionId } = await payments.createCheckoutForOrder(order.id);

    const declined = await payOnTestPaymentPage(checkoutUrl, { number: decliningTestCard });
    expect(declined.status).toBe(402);
    expect(declined.html).toContain('Your card was declined.');
    expect(declined.location).toBeNull();

    await settle();
    expect((await orderRow(order.id)).status).toBe('pending_payment');
    expect(await eventsAbout(checkoutSessionId)).toEqual([]);
    expect(await outboxCount(`order-confirmed:${order.id}`)).toBe(0);
    expect(await inboxOf(mailCatcherUrl, customer.email)).toEqual([]);
    expect((await stripe.checkout.sessions.retrieve(checkoutSessionId)).status).toBe('open');
  });

  it('returning to the success URL marks nothing paid: only the webhook does', async () => {
    const customer = await createCustomer('redirect-only');
    const order = await createGreenOrder(customer.id, lot.id);
    const { checkoutUrl, checkoutSessionId } = await payments.createCheckoutForOrder(order.id);
    await stripeFake().pauseWebhooks();
    try {
      const paid = await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard });
      expect(paid.status).toBe(303);
      await settle(500);
      expect((await orderRow(order.id)).status).toBe('pending_payment');
      expect((await stripe.checkout.sessions.retrieve(checkoutSessionId)).payment_status).toBe('paid');
    } finally {
      await stripeFake().resumeWebhooks();
    }
    await waitFor(
      () => orderRow(order.id),
      (row) => row.status === 'paid',
      10_000,
      'the held webhook to pay the order',
    );
  });
});

describe('createCheckoutForOrder', () => {
  it('gives every request for one order the same open session (one idempotency key per order)', async () => {
    const customer = await createCustomer('same-session');
    const order = await createGreenOrder(customer.id, lot.id);
    const [first, second] = await Promise.all([payments.createCheckoutForOrder(order.id), payments.createCheckoutForOrder(order.id)]);
    expect(second.checkoutSessionId).toBe(first.checkoutSessionId);
    const third = await payments.createCheckoutForOrder(order.id);
    expect(third.checkoutUrl).toBe(first.checkoutUrl);
  });

  it('starts a new session once the old one has expired', async () => {
    const customer = await createCustomer('expired-session');
    const order = await createGreenOrder(customer.id, lot.id);
    const first = await payments.createCheckoutForOrder(order.id);
    // The expiry webhook cancels an unpaid green order (its stock goes back); held here, it arrives
    // after the new session is on the order, and an old session's expiry leaves the order alone.
    await stripeFake().pauseWebhooks();
    let second: Awaited<ReturnType<typeof payments.createCheckoutForOrder>>;
    try {
      await stripe.checkout.sessions.expire(first.checkoutSessionId);
      second = await payments.createCheckoutForOrder(order.id);
    } finally {
      await stripeFake().resumeWebhooks();
    }
    expect(second.checkoutSessionId).not.toBe(first.checkoutSessionId);
    expect((await stripe.checkout.sessions.retrieve(second.checkoutSessionId)).status).toBe('open');
    expect((await orderRow(order.id)).stripeCheckoutSessionId).toBe(second.checkoutSessionId);
    await waitFor(
      () => eventsAbout(first.checkoutSessionId, 'checkout.session.expired'),
      (events) => events[0]?.status === 'delivered',
      10_000,
      'the held expiry webhook',
    );
    expect((await orderRow(order.id)).status).toBe('pending_payment');
  });

  it('refuses an order that is already paid, and an order that does not exist', async () => {
    const customer = await createCustomer('already-paid');
    const order = await createGreenOrder(customer.id, lot.id);
    const { checkoutUrl } = await payments.createCheckoutForOrder(order.id);
    await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard });
    await waitFor(
      () => orderRow(order.id),
      (row) => row.status === 'paid',
      10_000,
      'the order to be paid',
    );

    await expect(payments.createCheckoutForOrder(order.id)).rejects.toMatchObject({ status: 409, code: 'order_not_payable' });
    await expect(payments.createCheckoutForOrder('00000000-0000-4000-8000-000000000000')).rejects.toMatchObject({ status: 404, code: 'not_found' });
  });
});

describe('subscription checkout', () => {
  it('paying with 4242 starts the subscription with a weekly recurring price, stores its Stripe ids and sends subscription-started', async () => {
    const customer = await createCustomer('subscribes');
    const subscription = await createPendingSubscription(customer.id, lot.id);
    const { checkoutUrl, checkoutSessionId } = await payments.createCheckoutForSubscription(subscription.id);
    const session = await stripe.checkout.sessions.retrieve(checkoutSessionId, { expand: ['line_items'] });
    expect(session.mode).toBe('subscription');
    expect(session.line_items?.data[0]?.price).toMatchObject({ unit_amount: 3600, recurring: { interval: 'week', interval_count: 2 } });

    const paid = await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard });
    expect(paid.status).toBe(303);
    const row = await waitFor(
      () => subscriptionRow(subscription.id),
      (current) => current.status === 'active',
      10_000,
      'the subscription to start',
    );
    expect(row.stripeSubscriptionId).toMatch(/^sub_/);
    expect(row.stripeCustomerId).toMatch(/^cus_/);
    expect(row.stripeCheckoutSessionId).toBe(checkoutSessionId);
    const stripeSubscription = await stripe.subscriptions.retrieve(row.stripeSubscriptionId!);
    expect(row.currentPeriodEnd?.getTime()).toBe(stripeSubscription.items.data[0]!.current_period_end * 1000);

    const inbox = await waitFor(
      () => inboxOf(mailCatcherUrl, customer.email),
      (mails) => mails.length > 0,
      15_000,
      'the subscription-started e-mail',
    );
    expect(inbox.map((mail) => mail.subject)).toEqual(['Your Roasted to Order subscription has started']);
    await expect(payments.createCheckoutForSubscription(subscription.id)).rejects.toMatchObject({ status: 409, code: 'subscription_not_payable' });
  });
});

describe('the local Stripe fake, through the real SDK', () => {
  const sessionParams = (amount: number): Stripe.Checkout.SessionCreateParams => ({
    mode: 'payment',
    success_url: 'http://127.0.0.1:1/done',
    line_items: [{ price_data: { currency: 'usd', unit_amount: amount, product_data: { name: 'Invented sample' } }, quantity: 1 }],
  });

  it('honours Idempotency-Key: the same key replays the first answer; the same key with other parameters is an idempotency error', async () => {
    const key = `test-${randomUUID()}`;
    const first = await stripe.checkout.sessions.create(sessionParams(500), { idempotencyKey: key });
    const replay = await stripe.checkout.sessions.create(sessionParams(500), { idempotencyKey: key });
    expect(replay.id).toBe(first.id);
    await expect(stripe.checkout.sessions.create(sessionParams(501), { idempotencyKey: key })).rejects.toBeInstanceOf(Stripe.errors.StripeIdempotencyError);
  });

  it("answers in Stripe's error format, so the SDK raises its typed errors", async () => {
    await expect(stripe.checkout.sessions.retrieve('cs_test_missing')).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      code: 'resource_missing',
      statusCode: 404,
    });
    await expect(stripe.checkout.sessions.create({ ...sessionParams(500), shipping_cost: 1 } as Stripe.Checkout.SessionCreateParams)).rejects.toMatchObject({
      type: 'StripeInvalidRequestError',
      code: 'parameter_unknown',
      param: 'shipping_cost',
    });
    await expect(
      stripe.checkout.sessions.create({ ...sessionParams(500), line_items: [{ price_data: { currency: 'usd', product_data: { name: 'x' } }, quantity: 1 }] }),
    ).rejects.toMatchObject({ code: 'parameter_missing', param: 'line_items[0][price_data][unit_amount]' });
  });
});
