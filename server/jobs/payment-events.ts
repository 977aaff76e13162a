import { createPaymentsGateway } from '../integrations/payments';
import { cancelUnpaidOrder } from '../modules/checkout';
import { createPaymentEvents, type PaymentEventPorts } from '../modules/payments';
import { holdUnpaidCycle, recordPaidCycle } from '../modules/subscriptions';
import type { JobContext } from './registry';
import { defineJob } from './registry';

/** How long an inbox event may wait for its job before the sweep applies it itself. */
const SWEEP_AFTER_MS = 60_000;

/** What an applied payment event changes in the checkout and subscriptions modules. */
export const paymentEventPorts: PaymentEventPorts = { cancelUnpaidOrder, recordPaidCycle, holdUnpaidCycle };

function paymentEvents({ db, clock, logger, config }: JobContext) {
  return createPaymentEvents({ db, ports: paymentEventPorts, gateway: createPaymentsGateway(config), clock, logger, config });
}

/**
 * Applies one payment event the webhook put in the inbox. Two workers per process, each taking up
 * to 25 queued events per fetch and applying them one by one: a burst of events queues up here
 * instead of holding the shop's database connections, and drains at the rate the work allows.
 */
export const applyPaymentEventJob = defineJob<{ eventId: string }>({
  name: 'apply-payment-event',
  retryLimit: 10,
  retryDelaySeconds: 5,
  concurrency: 2,
  batchSize: 25,
  pollingIntervalSeconds: 0.5,
  async run({ eventId }, context) {
    await paymentEvents(context).applyEvent(eventId);
  },
});

/** Every minute: applies inbox events whose job never ran (a queue that was down when they came). */
export const paymentEventsSweepJob = defineJob<Record<string, never>>({
  name: 'payment-events-sweep',
  schedule: { cron: '* * * * *' },
  retryLimit: 2,
  async run(_data, context) {
    const applied = await paymentEvents(context).applyWaitingEvents(SWEEP_AFTER_MS);
    if (applied > 0) context.logger.warn({ applied }, 'payment events applied by the sweep');
  },
});
