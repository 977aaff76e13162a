// A typed client for the fake's control API and its test-payment page, for tests and demo scripts
// (vitest's global set-up runs the fake in another process, so tests reach it over HTTP).
import type { z } from 'zod';
import type { RenewalSummary } from './fake-account';
import type { advanceClockBody } from './control-routes';
import type { Delivery, DeliveryAttempt } from './store';
import type { EventType } from './stripe-objects';

export interface DeliveryView extends Delivery {
  type: EventType;
  objectId: string | null;
  created: number;
}

export interface TestCardEntry {
  number: string;
  /** MM/YY */
  expiry?: string;
  cvc?: string;
}

export interface PagePaymentResult {
  status: number;
  /** Where the page sent the payer (the session's success URL) when the payment went through. */
  location: string | null;
  html: string;
}

export function stripeFakeControl(baseUrl: string) {
  async function call<T>(method: string, path: string, body?: unknown): Promise<T> {
    const response = await fetch(`${baseUrl}/control${path}`, {
      method,
      headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    const json = (await response.json()) as T;
    if (!response.ok) throw new Error(`Stripe fake ${method} /control${path} answered ${response.status}: ${JSON.stringify(json)}`);
    return json;
  }

  return {
    now: () => call<{ now: number }>('GET', '/clock').then((body) => body.now),
    /** Moves the fake's clock; subscriptions whose period ends renew (paid or failed by their card). */
    advanceClock: (by: z.input<typeof advanceClockBody>) => call<{ now: number; renewals: RenewalSummary[] }>('POST', '/clock', by),
    setWebhookEndpoint: (url: string | null) => call<{ url: string | null }>('PUT', '/webhook-endpoint', { url }),
    pauseWebhooks: () => call<{ paused: boolean }>('POST', '/webhooks/pause'),
    resumeWebhooks: () => call<{ paused: boolean }>('POST', '/webhooks/resume'),
    deliveries: (type?: EventType) =>
      call<{ items: DeliveryView[] }>('GET', `/deliveries${type ? `?type=${encodeURIComponent(type)}` : ''}`).then((body) => body.items),
    /** Sends one event once more, now, and says how the endpoint answered. */
    deliverEvent: (eventId: string) => call<DeliveryAttempt>('POST', `/events/${encodeURIComponent(eventId)}/deliver`),
    setCustomerCard: (customerId: string, number: string) =>
      call<{ paymentMethod: string; brand: string; last4: string }>('POST', `/customers/${encodeURIComponent(customerId)}/card`, { number }),
  };
}

export type StripeFakeControl = ReturnType<typeof stripeFakeControl>;

/** Does what a person does on the test-payment page: open it, fill in a card, press Pay. */
export async function payOnTestPaymentPage(checkoutUrl: string, card: TestCardEntry): Promise<PagePaymentResult> {
  const form = await fetch(checkoutUrl);
  const page = await form.text();
  if (!form.ok || !page.includes('name="cardNumber"')) throw new Error(`${checkoutUrl} is not an open test-payment page (HTTP ${form.status})`);
  const response = await fetch(checkoutUrl, {
    method: 'POST',
    headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
    body: new URLSearchParams({ cardNumber: card.number, expiry: card.expiry ?? '12/40', cvc: card.cvc ?? '123' }),
    redirect: 'manual',
  });
  return { status: response.status, location: response.headers.get('location'), html: await response.text() };
}
