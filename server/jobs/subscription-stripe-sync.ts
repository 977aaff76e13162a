import { createPaymentsGateway } from '../integrations/payments';
import { createStripeSync } from '../modules/subscriptions/stripe-sync.service';
import { defineJob } from './registry';

/**
 * Pushes self-service subscription changes to Stripe. Queued after each change for one
 * subscription, and every minute for all that are behind, so a Stripe outage only delays the push:
 * the API has already answered with the new state.
 */
export const subscriptionStripeSyncJob = defineJob<{ subscriptionId?: string }>({
  name: 'subscription-stripe-sync',
  retryLimit: 10,
  retryDelaySeconds: 15,
  schedule: { cron: '* * * * *' },
  async run(data, { db, clock, logger, config }) {
    const sync = createStripeSync({ db, gateway: createPaymentsGateway(config), clock, logger });
    if (data.subscriptionId) await sync.push(data.subscriptionId);
    else await sync.pushAllBehind();
  },
});
