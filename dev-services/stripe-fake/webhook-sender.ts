// Sends each event to the webhook endpoint, signed as Stripe signs it, and retries with
// exponential backoff until the endpoint answers 2xx (or the attempts run out).
import { backoffDelayMs } from '../../shared/domain/backoff';
import { signatureHeader } from './signature';
import type { Delivery, DeliveryAttempt, Store } from './store';
import type { StripeEvent } from './stripe-objects';

export interface RetryPolicy {
  /** Delay before the first retry; each later retry waits twice as long, up to maxDelayMs. */
  initialDelayMs: number;
  maxDelayMs: number;
  maxAttempts: number;
  /** How long one attempt waits for an answer. */
  timeoutMs: number;
}

/** Stripe keeps retrying for days; a development fake gives up after about half an hour. */
export const defaultRetryPolicy: RetryPolicy = { initialDelayMs: 1000, maxDelayMs: 60_000, maxAttempts: 40, timeoutMs: 10_000 };

export function retryDelayMs(policy: RetryPolicy, failedAttempts: number): number {
  return backoffDelayMs(policy.initialDelayMs, policy.maxDelayMs, failedAttempts);
}

export function createWebhookSender(options: { store: Store; secret: string; endpointUrl: string | null; retry: RetryPolicy }) {
  const { store, retry } = options;
  const state = store.state;
  let endpointUrl = options.endpointUrl;
  let paused = false;
  let stopped = false;
  const timers = new Map<string, NodeJS.Timeout>();
  const inFlight = new Set<Promise<unknown>>();
  const stopping = new AbortController();

  async function attempt(delivery: Delivery): Promise<DeliveryAttempt> {
    const event = state.events[delivery.eventId];
    const url = delivery.url;
    if (!event || !url) throw new Error(`event ${delivery.eventId} cannot be delivered`);
    const payload = JSON.stringify(event, null, 2);
    // Signed with the real time of this attempt (not the fake's clock): the receiver checks its age.
    const signature = signatureHeader(payload, options.secret, Math.floor(Date.now() / 1000));
    const record: DeliveryAttempt = { at: Date.now(), statusCode: null, error: null };
    const sending = (async () => {
      try {
        const response = await fetch(url, {
          method: 'POST',
          headers: { 'Content-Type': 'application/json; charset=utf-8', 'Stripe-Signature': signature, 'User-Agent': 'restday-stripe-fake' },
          body: payload,
          signal: AbortSignal.any([stopping.signal, AbortSignal.timeout(retry.timeoutMs)]),
        });
        await response.arrayBuffer();
        record.statusCode = response.status;
      } catch (error) {
        record.error = error instanceof Error ? error.message : String(error);
      }
    })();
    inFlight.add(sending);
    await sending;
    inFlight.delete(sending);
    delivery.attempts.push(record);
    const answered = record.statusCode !== null && record.statusCode >= 200 && record.statusCode < 300;
    if (answered) delivery.status = 'delivered';
    else if (delivery.status === 'pending' && delivery.attempts.length >= retry.maxAttempts) delivery.status = 'failed';
    store.changed();
    return record;
  }

  function schedule(delivery: Delivery, delayMs: number) {
    if (stopped || paused || delivery.status !== 'pending' || timers.has(delivery.eventId)) return;
    const timer = setTimeout(() => {
      timers.delete(delivery.eventId);
      if (paused || stopped || delivery.status !== 'pending') return;
      void attempt(delivery).then(() => {
        if (!stopped) schedule(delivery, retryDelayMs(retry, delivery.attempts.length));
      });
    }, delayMs);
    timers.set(delivery.eventId, timer);
  }

  return {
    enqueue(event: StripeEvent) {
      const delivery: Delivery = { eventId: event.id, url: endpointUrl, status: endpointUrl ? 'pending' : 'undeliverable', attempts: [] };
      state.deliveries[event.id] = delivery;
      store.changed();
      schedule(delivery, 0);
    },

    /** One attempt now, whatever the delivery's state (tests deliver duplicates and out of order with it). */
    async deliverNow(eventId: string): Promise<DeliveryAttempt> {
      const delivery = state.deliveries[eventId];
      if (!delivery) throw new Error(`No event ${eventId}`);
      if (!delivery.url) delivery.url = endpointUrl;
      clearTimeout(timers.get(eventId));
      timers.delete(eventId);
      const record = await attempt(delivery);
      schedule(delivery, retryDelayMs(retry, delivery.attempts.length));
      return record;
    },

    /** Events created from now on go to this endpoint; earlier ones keep the endpoint they had. */
    setEndpoint(url: string | null) {
      endpointUrl = url;
    },

    /** While paused, events wait as pending; resuming sends every pending one. */
    pause() {
      paused = true;
      for (const timer of timers.values()) clearTimeout(timer);
      timers.clear();
    },

    resume() {
      paused = false;
      for (const delivery of Object.values(state.deliveries)) schedule(delivery, 0);
    },

    async stop() {
      stopped = true;
      for (const timer of timers.values()) clearTimeout(timer);
      timers.clear();
      stopping.abort();
      await Promise.allSettled([...inFlight]);
    },
  };
}

export type WebhookSender = ReturnType<typeof createWebhookSender>;
