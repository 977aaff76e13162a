import type { Db } from '../../db/client';
import type { PaymentsGateway } from '../../integrations/payments';
import type { ApiModule } from '../../lib/api-module';
import { createPaymentEventsService, type PaymentEventsDeps } from './payment-events.service';
import { createPaymentsRepo } from './payments.repo';
import { paymentsWebhookRoutes } from './payments.routes';
import { createPaymentsService as createPaymentsServiceOn, type PaymentsServiceConfig } from './payments.service';

export { orderIdKey, subscriptionIdKey, type PaymentsService } from './payments.service';
export type { PaidInvoice, PaymentEventPorts } from './payment-event-ports';

/** The one payments service of the app: starts Stripe checkouts for orders and subscriptions. */
export function createPaymentsService({ db, gateway, config }: { db: Db; gateway: PaymentsGateway; config: PaymentsServiceConfig }) {
  return createPaymentsServiceOn({ repo: createPaymentsRepo(db), gateway, config });
}

/** Applies Stripe's events (the webhook and the queue's job share it). */
export function createPaymentEvents({ db, ...deps }: Omit<PaymentEventsDeps, 'repo'> & { db: Db }) {
  return createPaymentEventsService({ repo: createPaymentsRepo(db), ...deps });
}

/**
 * Stripe's webhook at `/api/payments/webhook`. Mount it before any body parser: Stripe signs the
 * raw body, and that signature is its authentication.
 */
export function createPaymentsWebhookModule(deps: Omit<PaymentEventsDeps, 'repo'> & { db: Db }): ApiModule {
  return { mounts: [{ path: '/payments', router: paymentsWebhookRoutes(createPaymentEvents(deps)) }] };
}
