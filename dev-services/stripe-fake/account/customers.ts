// Customers and the card their subscriptions charge.
import { StripeApiError } from '../api-error';
import type { CustomerCreateParams } from '../params';
import { newId } from '../store';
import type { Customer, PaymentMethod } from '../stripe-objects';
import { checkCardNumber } from '../test-cards';
import { savePaymentMethod, type CardDetails } from './cards';
import type { AccountContext } from './context';

export function createCustomer({ state, now }: AccountContext, params: CustomerCreateParams): Customer {
  const customer: Customer = {
    id: newId('cus', 14),
    object: 'customer',
    email: params.email ?? null,
    name: params.name ?? null,
    metadata: params.metadata ?? {},
    invoice_settings: { default_payment_method: null },
    created: now(),
    livemode: false,
  };
  state.customers[customer.id] = customer;
  return customer;
}

export function customerApi(ctx: AccountContext) {
  const { store, state, find } = ctx;
  return {
    createCustomer(params: CustomerCreateParams) {
      const customer = createCustomer(ctx, params);
      store.changed();
      return customer;
    },

    updateCustomer(id: string, params: CustomerCreateParams) {
      const customer = find(state.customers, id, 'customer');
      if (params.email !== undefined) customer.email = params.email;
      if (params.name !== undefined) customer.name = params.name;
      if (params.metadata !== undefined) customer.metadata = { ...customer.metadata, ...params.metadata };
      store.changed();
      return customer;
    },

    /** Replaces the card a customer's subscriptions charge (a test card number). */
    setCustomerCard(id: string, card: CardDetails): PaymentMethod {
      const customer = find(state.customers, id, 'customer');
      const check = checkCardNumber(card.number);
      if (!check.ok) throw StripeApiError.card(check.decline.code, check.decline.message, check.decline.declineCode);
      const method = savePaymentMethod(ctx, card, customer.id);
      customer.invoice_settings.default_payment_method = method.id;
      for (const subscription of Object.values(state.subscriptions)) {
        if (subscription.customer === customer.id) subscription.default_payment_method = method.id;
      }
      store.changed();
      return method;
    },
  };
}
