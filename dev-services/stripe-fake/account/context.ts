// What every part of one fake account shares: its state, its clock (real time plus the offset that
// `advanceClock` adds), and the way it announces a change as an event.
import { StripeApiError } from '../api-error';
import { newId, type FakeState, type Store } from '../store';
import type { ApiList, EventType, StripeEvent, StripeObject } from '../stripe-objects';

/** The API version the fake's objects follow: the one stripe-node 23 pins. */
export const fakeApiVersion = '2026-10-28.endive';

export const day = 86_400;

export interface AccountContext {
  store: Store;
  state: FakeState;
  /** Where the fake's own pages are served (the test-payment page). */
  baseUrl: () => string;
  /** The fake's clock, in Unix seconds. */
  now(): number;
  /** Records an event and hands it to the webhook sender. */
  emit(type: EventType, object: StripeObject, previousAttributes?: Record<string, unknown>): void;
  /** An object by id, or Stripe's "No such …" error naming `param`. */
  find<T>(collection: Record<string, T>, id: string, kind: string, param?: string): T;
}

export function createAccountContext(options: { store: Store; baseUrl: () => string; onEvent: (event: StripeEvent) => void }): AccountContext {
  const { store, baseUrl, onEvent } = options;
  const state = store.state;
  const now = () => Math.floor(Date.now() / 1000) + state.clockOffsetSeconds;
  return {
    store,
    state,
    baseUrl,
    now,
    emit(type, object, previousAttributes) {
      const event: StripeEvent = {
        id: newId('evt'),
        object: 'event',
        api_version: fakeApiVersion,
        created: now(),
        // A snapshot: later changes to the object must not rewrite what the event said.
        data: { object: structuredClone(object), ...(previousAttributes ? { previous_attributes: previousAttributes } : {}) },
        livemode: false,
        pending_webhooks: 1,
        request: { id: null, idempotency_key: null },
        type,
      };
      state.events[event.id] = event;
      onEvent(event);
    },
    find<T>(collection: Record<string, T>, id: string, kind: string, param = 'id'): T {
      const found = collection[id];
      if (!found) throw StripeApiError.missing(kind, id, param);
      return found;
    },
  };
}

export function emptyList<T>(url: string, data: T[] = []): ApiList<T> {
  return { object: 'list', data, has_more: false, url };
}
