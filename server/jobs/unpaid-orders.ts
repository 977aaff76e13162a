import { createPaymentsGateway } from '../integrations/payments';
import { systemClock } from '../lib/clock';
import { createUnpaidOrdersRepo } from '../modules/checkout/unpaid-orders.repo';
import { createUnpaidOrdersService } from '../modules/checkout/unpaid-orders.service';
import { defineJob } from './registry';

/**
 * Every minute: cancel green orders nobody can pay any more (no payment page saved after
 * UNPAID_ORDER_GRACE_MINUTES, or a page Stripe says expired) and put their stock back. The windows
 * are real time (see createUnpaidOrdersService); two runs at once cancel nothing twice.
 */
export const unpaidOrdersJob = defineJob<Record<string, never>>({
  name: 'unpaid-orders',
  schedule: { cron: '* * * * *' },
  retryLimit: 3,
  async run(_data, { db, clock, logger, config }) {
    const service = createUnpaidOrdersService({
      repo: createUnpaidOrdersRepo(db),
      gateway: createPaymentsGateway(config),
      clock,
      realClock: systemClock,
      logger,
      graceMinutes: config.UNPAID_ORDER_GRACE_MINUTES,
      pageMinutes: config.STRIPE_CHECKOUT_EXPIRES_MINUTES,
    });
    await service.reconcile();
  },
});
