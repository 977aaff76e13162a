// One fake Stripe account: the objects Restday creates and reads, and what happens to them when a
// test card pays, a subscription period ends, or a refund is made. Every change that Stripe would
// announce becomes an event, handed to `onEvent` for delivery. Each topic lives in account/.
import { checkoutSessionApi } from './account/checkout-sessions';
import { clockApi } from './account/clock';
import { createAccountContext } from './account/context';
import { customerApi } from './account/customers';
import { invoiceApi } from './account/invoices';
import { refundApi } from './account/refunds';
import { subscriptionApi } from './account/subscriptions';
import type { Store } from './store';
import type { StripeEvent } from './stripe-objects';

export type { RenewalSummary } from './account/clock';
export { emptyList } from './account/context';

export function createFakeAccount(options: { store: Store; baseUrl: () => string; onEvent: (event: StripeEvent) => void }) {
  const ctx = createAccountContext(options);
  return {
    ...clockApi(ctx),
    ...customerApi(ctx),
    ...checkoutSessionApi(ctx),
    ...subscriptionApi(ctx),
    ...invoiceApi(ctx),
    ...refundApi(ctx),
  };
}

export type FakeAccount = ReturnType<typeof createFakeAccount>;
