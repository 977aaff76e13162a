import { randomBytes } from 'node:crypto';
import Stripe from 'stripe';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { greenOrderDates } from '@shared/domain/roast-schedule';
import { apiErrorSchema } from '@shared/schemas/errors';
import { webhookReceiptSchema } from '@shared/schemas/payments';
import { payOnTestPaymentPage } from '../../dev-services/stripe-fake/control-client';
import { succeedingTestCard } from '../../dev-services/stripe-fake/test-cards';
import { loadCalendarOverrides, loadShopSettings } from '../../server/modules/settings/settings.repo';
import { getTestDb } from '../setup/test-db';
import { inboxOf, waitFor } from './outbox-support';
import {
  deliveryRows,
  eventsAbout,
  ledgerCount,
  orderCount,
  eventApplied,
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

// Stripe's published test card that saves to a customer and then fails every charge (Stripe docs, Testing).
const failsOnCharge = '4000000000000341';

let running: PaymentsServer;
let lot: { id: string; name: string };
let payments: ReturnType<typeof testPaymentsService>;
const stripe = testStripe();
const fake = stripeFake();
const mailCatcherUrl = inject('mailCatcherUrl');
const webhookSecret = inject('stripeWebhookSecret');

beforeAll(async () => {
  running = await startPaymentsServer();
  payments = testPaymentsService(running.config);
  lot = await createLotForSale(50_000);
});

afterAll(async () => {
  await fake.resumeWebhooks();
  await running.stop();
});

/** Runs `act` with delivery paused, so the test decides which events arrive, when, and how often. */
async function withWebhooksHeld<T>(act: () => Promise<T>): Promise<T> {
  await fake.pauseWebhooks();
  try {
    return await act();
  } finally {
    await fake.resumeWebhooks();
  }
}

async function onlyEvent(objectId: string, type: Parameters<typeof eventsAbout>[1]) {
  const found = await eventsAbout(objectId, type);
  expect(found).toHaveLength(1);
  return found[0]!.eventId;
}

/** A paid green order whose checkout.session.completed event has not been delivered (delivery is held). */
async function paidOrderWithHeldEvent(tag: string) {
  const customer = await createCustomer(tag);
  const order = await createGreenOrder(customer.id, lot.id);
  const { checkoutUrl, checkoutSessionId } = await payments.createCheckoutForOrder(order.id);
  expect((await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard })).status).toBe(303);
  const completedEventId = await onlyEvent(checkoutSessionId, 'checkout.session.completed');
  return { customer, order, checkoutSessionId, completedEventId };
}

function postWebhook(body: string, signature?: string) {
  return fetch(`${running.server.url}/api/payments/webhook`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', ...(signature === undefined ? {} : { 'Stripe-Signature': signature }) },
    body,
  });
}

describe('POST /api/payments/webhook — signatures', () => {
  it('refuses a forged signature, a wrong secret, a signature older than 300 s and a missing one with 400, writing nothing', async () => {
    await withWebhooksHeld(async () => {
      const { order, completedEventId } = await paidOrderWithHeldEvent('forged');
      const payload = JSON.stringify(await stripe.events.retrieve(completedEventId), null, 2);
      const now = Math.floor(Date.now() / 1000);

      const attempts = {
        forged: `t=${now},v1=${randomBytes(32).toString('hex')}`,
        wrongSecret: stripe.webhooks.generateTestHeaderString({ payload, secret: 'whsec_someone_else' }),
        tooOld: stripe.webhooks.generateTestHeaderString({ payload, secret: webhookSecret, timestamp: now - 301 }),
        missing: undefined,
      };
      for (const [name, signature] of Object.entries(attempts)) {
        const response = await postWebhook(payload, signature);
        expect(response.status, name).toBe(400);
        expect(apiErrorSchema.parse(await response.json()).error.code, name).toBe('invalid_signature');
      }
      expect(await ledgerCount([completedEventId])).toBe(0);
      expect((await orderRow(order.id)).status).toBe('pending_payment');
      expect(await outboxCount(`order-confirmed:${order.id}`)).toBe(0);

      // The same bytes, signed with the right secret just now, are accepted: the signature was the only fault.
      const signed = await postWebhook(payload, stripe.webhooks.generateTestHeaderString({ payload, secret: webhookSecret, timestamp: now - 299 }));
      expect(signed.status).toBe(200);
      expect(webhookReceiptSchema.parse(await signed.json())).toEqual({ received: true, duplicate: false });
      await eventApplied(completedEventId);
      expect((await orderRow(order.id)).status).toBe('paid');
    });
  });

  it('refuses a correctly signed body that is not the one signed', async () => {
    await withWebhooksHeld(async () => {
      const { order, completedEventId } = await paidOrderWithHeldEvent('tampered');
      const payload = JSON.stringify(await stripe.events.retrieve(completedEventId));
      const signature = stripe.webhooks.generateTestHeaderString({ payload, secret: webhookSecret });
      const response = await postWebhook(payload.replace('"livemode":false', '"livemode":true'), signature);
      expect(response.status).toBe(400);
      expect(await ledgerCount([completedEventId])).toBe(0);
      expect((await orderRow(order.id)).status).toBe('pending_payment');
    });
  });
});

describe('duplicates and order', () => {
  it('the same event delivered three times at once: one paid order, one ledger row, one e-mail', async () => {
    const { customer, order, completedEventId } = await withWebhooksHeld(async () => {
      const held = await paidOrderWithHeldEvent('thrice');
      const answers = await Promise.all([
        fake.deliverEvent(held.completedEventId),
        fake.deliverEvent(held.completedEventId),
        fake.deliverEvent(held.completedEventId),
      ]);
      expect(answers.map((answer) => answer.statusCode)).toEqual([200, 200, 200]);
      return held;
    });

    const paid = await orderRow(order.id);
    expect(paid.status).toBe('paid');
    // A paid green order gets its ship day at once, so it reaches that day's Pack List.
    const { settings } = await loadShopSettings(getTestDb());
    expect(paid.shipDate).toBe(greenOrderDates(paid.paidAt!, settings, { overrides: await loadCalendarOverrides(getTestDb(), '2000-01-01') }).shipDate);
    expect(await ledgerCount([completedEventId])).toBe(1);
    expect(await outboxCount(`order-confirmed:${order.id}`)).toBe(1);
    await waitFor(
      () => inboxOf(mailCatcherUrl, customer.email),
      (mails) => mails.length > 0,
      15_000,
      'the order-confirmed e-mail',
    );
    await settle();
    expect(await inboxOf(mailCatcherUrl, customer.email)).toHaveLength(1);
  });

  it('a partial refund delivered before the payment it refunds: one paid order with the refund recorded, one e-mail', async () => {
    const { customer, order, checkoutSessionId } = await withWebhooksHeld(async () => {
      const held = await paidOrderWithHeldEvent('out-of-order');
      const session = await stripe.checkout.sessions.retrieve(held.checkoutSessionId);
      const refund = await stripe.refunds.create({ payment_intent: session.payment_intent as string, amount: 1050 });
      const refundedEventId = await onlyEvent(refund.charge as string, 'charge.refunded');

      expect((await fake.deliverEvent(refundedEventId)).statusCode).toBe(200);
      expect(await orderRow(held.order.id)).toMatchObject({ status: 'pending_payment', refundedCents: 1050 });
      expect((await fake.deliverEvent(held.completedEventId)).statusCode).toBe(200);
      // And both again, in the other order.
      expect((await fake.deliverEvent(held.completedEventId)).statusCode).toBe(200);
      expect((await fake.deliverEvent(refundedEventId)).statusCode).toBe(200);
      expect(await ledgerCount([refundedEventId, held.completedEventId])).toBe(2);
      return held;
    });

    expect(await orderRow(order.id)).toMatchObject({ status: 'paid', refundedCents: 1050, stripeCheckoutSessionId: checkoutSessionId });
    expect(await orderCount(customer.id)).toBe(1);
    expect(await outboxCount(`order-confirmed:${order.id}`)).toBe(1);
    await waitFor(
      () => inboxOf(mailCatcherUrl, customer.email),
      (mails) => mails.length > 0,
      15_000,
      'the order-confirmed e-mail',
    );
    await settle();
    expect(await inboxOf(mailCatcherUrl, customer.email)).toHaveLength(1);
  });

  it('refunding the rest makes the order refunded, whatever order the refund events arrive in', async () => {
    const { order } = await withWebhooksHeld(async () => {
      const held = await paidOrderWithHeldEvent('refund-all');
      const paymentIntent = (await stripe.checkout.sessions.retrieve(held.checkoutSessionId)).payment_intent as string;
      const first = await stripe.refunds.create({ payment_intent: paymentIntent, amount: 849 });
      await stripe.refunds.create({ payment_intent: paymentIntent });
      const [earlier, later] = await eventsAbout(first.charge as string, 'charge.refunded');
      expect((await fake.deliverEvent(held.completedEventId)).statusCode).toBe(200);
      expect((await fake.deliverEvent(later!.eventId)).statusCode).toBe(200);
      expect((await fake.deliverEvent(earlier!.eventId)).statusCode).toBe(200);
      return held;
    });
    expect(await orderRow(order.id)).toMatchObject({ status: 'refunded', refundedCents: 4849 });
  });
});

describe('subscriptions renewing on the fake clock', () => {
  async function activeSubscription(tag: string) {
    const customer = await createCustomer(tag);
    const subscription = await createPendingSubscription(customer.id, lot.id);
    const { checkoutUrl } = await payments.createCheckoutForSubscription(subscription.id);
    await payOnTestPaymentPage(checkoutUrl, { number: succeedingTestCard });
    const row = await waitFor(
      () => subscriptionRow(subscription.id),
      (current) => current.status === 'active',
      10_000,
      'the subscription to start',
    );
    return { customer, subscription, stripeSubscriptionId: row.stripeSubscriptionId!, stripeCustomerId: row.stripeCustomerId! };
  }

  it('a failed renewal makes the subscription past_due, holds its next delivery and sends one payment-failed e-mail; paying later releases it', async () => {
    const { customer, subscription, stripeSubscriptionId, stripeCustomerId } = await activeSubscription('renewal-fails');
    await fake.setCustomerCard(stripeCustomerId, failsOnCharge);

    const renewal = await fake.advanceClock({ days: 14 });
    expect(renewal.renewals).toContainEqual(expect.objectContaining({ subscription: stripeSubscriptionId, outcome: 'failed' }));
    await waitFor(
      () => subscriptionRow(subscription.id),
      (row) => row.status === 'past_due',
      10_000,
      'past_due',
    );
    const [held] = await waitFor(
      () => deliveryRows(subscription.id),
      (rows) => rows.some((row) => row.status === 'held'),
      10_000,
      'the delivery to be held',
    ).then((rows) => rows.filter((row) => row.status === 'held'));
    const failedInvoice = renewal.renewals.find((entry) => entry.subscription === stripeSubscriptionId)!.invoice!;
    const failedMail = await waitFor(
      () => inboxOf(mailCatcherUrl, customer.email),
      (mails) => mails.some((mail) => mail.subject === 'We could not take your payment'),
      15_000,
      'the payment-failed e-mail',
    );
    expect(failedMail.find((mail) => mail.subject === 'We could not take your payment')?.text).toContain('$36.00');

    // Stripe retries three days later, and fails again: still one e-mail for the invoice.
    await fake.advanceClock({ days: 3 });
    await waitFor(
      () => eventsAbout(failedInvoice, 'invoice.payment_failed'),
      (events) => events.every((event) => event.status === 'delivered') && events.length === 2,
    );
    await settle();
    expect(await outboxCount(`payment-failed:${failedInvoice}`)).toBe(1);

    await fake.setCustomerCard(stripeCustomerId, succeedingTestCard);
    await stripe.invoices.pay(failedInvoice);
    await waitFor(
      () => subscriptionRow(subscription.id),
      (row) => row.status === 'active',
      10_000,
      'active again',
    );
    const released = await waitFor(
      () => deliveryRows(subscription.id),
      (rows) => rows.some((row) => row.id === held!.id && row.status === 'scheduled' && row.orderId !== null),
      10_000,
      'the delivery to be released with its order',
    );
    expect(released.filter((row) => row.status === 'held')).toEqual([]);
    const inbox = await inboxOf(mailCatcherUrl, customer.email);
    expect(inbox.filter((mail) => mail.subject === 'We could not take your payment')).toHaveLength(1);
  });

  it('a payment-failed event delivered after the later payment changes nothing: no hold, no e-mail', async () => {
    const { subscription, stripeSubscriptionId, stripeCustomerId } = await activeSubscription('late-failure');
    await withWebhooksHeld(async () => {
      await fake.setCustomerCard(stripeCustomerId, failsOnCharge);
      const renewal = await fake.advanceClock({ days: 14 });
      const invoice = renewal.renewals.find((entry) => entry.subscription === stripeSubscriptionId)!.invoice!;
      await fake.setCustomerCard(stripeCustomerId, succeedingTestCard);
      await stripe.invoices.pay(invoice);

      const failed = await onlyEvent(invoice, 'invoice.payment_failed');
      const paid = await onlyEvent(invoice, 'invoice.paid');
      expect((await fake.deliverEvent(paid)).statusCode).toBe(200);
      expect((await fake.deliverEvent(failed)).statusCode).toBe(200);
      expect(await subscriptionRow(subscription.id)).toMatchObject({ status: 'active' });
      expect((await deliveryRows(subscription.id)).filter((row) => row.status === 'held')).toEqual([]);
      expect(await outboxCount(`payment-failed:${invoice}`)).toBe(0);
    });
  });

  it('collection paused in Stripe alone charges nothing meanwhile, but is no subscriber pause: the subscription stays active', async () => {
    const { subscription, stripeSubscriptionId } = await activeSubscription('pauses');
    const resumesAt = (await fake.now()) + 20 * 86_400;
    const updatesBefore = (await eventsAbout(stripeSubscriptionId, 'customer.subscription.updated')).length;
    await stripe.subscriptions.update(stripeSubscriptionId, { pause_collection: { behavior: 'void', resumes_at: resumesAt } });
    // The notice arrives and is applied; the pause is the subscriber's to make (Deliveries), so the status is not moved by it.
    await waitFor(
      () => eventsAbout(stripeSubscriptionId, 'customer.subscription.updated'),
      (events) => events.length > updatesBefore && events.every((event) => event.status === 'delivered'),
      10_000,
      'the update delivered',
    );
    expect((await subscriptionRow(subscription.id)).status).toBe('active');

    const renewal = await fake.advanceClock({ days: 14 });
    expect(renewal.renewals).toContainEqual(expect.objectContaining({ subscription: stripeSubscriptionId, outcome: 'skipped' }));
    const invoices = await stripe.invoices.list({ subscription: stripeSubscriptionId });
    expect(invoices.data.map((invoice) => [invoice.billing_reason, invoice.status])).toEqual([
      ['subscription_cycle', 'void'],
      ['subscription_create', 'paid'],
    ]);

    await stripe.subscriptions.update(stripeSubscriptionId, { pause_collection: '' });
    await waitFor(
      () => eventsAbout(stripeSubscriptionId, 'customer.subscription.updated'),
      (events) => events.length > updatesBefore + 1 && events.every((event) => event.status === 'delivered'),
      10_000,
      'the second update delivered',
    );
    expect((await subscriptionRow(subscription.id)).status).toBe('active');
  });

  it('a new bag price takes effect at the next renewal, and a new cadence restarts the period and bills it at once', async () => {
    const { stripeSubscriptionId } = await activeSubscription('changes');
    const before = await stripe.subscriptions.retrieve(stripeSubscriptionId);
    const item = before.items.data[0]!;
    const product = item.price.product as string;
    await stripe.subscriptions.update(stripeSubscriptionId, {
      items: [{ id: item.id, price_data: { currency: 'usd', product, unit_amount: 5400, recurring: { interval: 'week', interval_count: 2 } }, quantity: 1 }],
      proration_behavior: 'none',
    });
    const renewal = await fake.advanceClock({ days: 14 });
    const renewed = renewal.renewals.find((entry) => entry.subscription === stripeSubscriptionId)!;
    expect((await stripe.invoices.retrieve(renewed.invoice!)).amount_paid).toBe(5400);

    const now = await fake.now();
    await stripe.subscriptions.update(stripeSubscriptionId, {
      items: [{ id: item.id, price_data: { currency: 'usd', product, unit_amount: 5400, recurring: { interval: 'week', interval_count: 4 } } }],
    });
    const after = await stripe.subscriptions.retrieve(stripeSubscriptionId, { expand: ['latest_invoice'] });
    expect(after.items.data[0]!.current_period_end - now).toBeGreaterThanOrEqual(28 * 86_400);
    expect(after.latest_invoice).toMatchObject({ billing_reason: 'subscription_update', status: 'paid', amount_paid: 5400 });
  });

  it('cancelling in Stripe reaches Restday as a cancelled subscription', async () => {
    const { subscription, stripeSubscriptionId } = await activeSubscription('cancels');
    await stripe.subscriptions.update(stripeSubscriptionId, { cancel_at_period_end: true });
    await settle(500);
    expect((await subscriptionRow(subscription.id)).status).toBe('active');

    await stripe.subscriptions.cancel(stripeSubscriptionId);
    const row = await waitFor(
      () => subscriptionRow(subscription.id),
      (current) => current.status === 'cancelled',
      10_000,
      'cancelled',
    );
    expect(row.cancelledAt).toBeInstanceOf(Date);
    await expect(stripe.subscriptions.cancel(stripeSubscriptionId)).rejects.toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
  });
});
