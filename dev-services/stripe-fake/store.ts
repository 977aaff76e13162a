// The fake's whole state as one plain object: in memory, optionally mirrored to a JSON file so a
// restarted `npm start` still knows the sessions and subscriptions Restday's database points at.
import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import type {
  Charge,
  CheckoutSession,
  Customer,
  Invoice,
  LineItem,
  Metadata,
  PaymentIntent,
  PaymentMethod,
  Price,
  Product,
  Refund,
  StripeEvent,
  Subscription,
} from './stripe-objects';

export interface DeliveryAttempt {
  /** Unix milliseconds, real time. */
  at: number;
  statusCode: number | null;
  error: string | null;
}

export interface Delivery {
  eventId: string;
  /** The endpoint the event was created for; null when none was configured then. */
  url: string | null;
  status: 'pending' | 'delivered' | 'failed' | 'undeliverable';
  attempts: DeliveryAttempt[];
}

export interface StoredResponse {
  fingerprint: string;
  status: number;
  body: unknown;
  /** Unix milliseconds; keys are forgotten after 24 hours, as Stripe prunes them. */
  createdAt: number;
}

export interface SessionSettings {
  paymentIntentMetadata: Metadata;
  subscriptionMetadata: Metadata;
}

export interface FakeState {
  version: 1;
  /** Seconds the fake's clock runs ahead of real time (moved by the control endpoint). */
  clockOffsetSeconds: number;
  customers: Record<string, Customer>;
  products: Record<string, Product>;
  prices: Record<string, Price>;
  sessions: Record<string, CheckoutSession>;
  sessionLineItems: Record<string, LineItem[]>;
  /** What a session passes on to the payment intent or subscription it creates. */
  sessionSettings: Record<string, SessionSettings>;
  paymentMethods: Record<string, PaymentMethod>;
  /** Full test card numbers by payment method id; Stripe never returns these, neither does the fake. */
  cardNumbers: Record<string, string>;
  paymentIntents: Record<string, PaymentIntent>;
  charges: Record<string, Charge>;
  refunds: Record<string, Refund>;
  subscriptions: Record<string, Subscription>;
  invoices: Record<string, Invoice>;
  events: Record<string, StripeEvent>;
  deliveries: Record<string, Delivery>;
  idempotency: Record<string, StoredResponse>;
}

function emptyState(): FakeState {
  return {
    version: 1,
    clockOffsetSeconds: 0,
    customers: {},
    products: {},
    prices: {},
    sessions: {},
    sessionLineItems: {},
    sessionSettings: {},
    paymentMethods: {},
    cardNumbers: {},
    paymentIntents: {},
    charges: {},
    refunds: {},
    subscriptions: {},
    invoices: {},
    events: {},
    deliveries: {},
    idempotency: {},
  };
}

const idAlphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** Stripe-style ids: a type prefix and random base-62 characters (`cus_…`, `cs_test_…`). */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let id = '';
  for (const byte of bytes) id += idAlphabet[byte % idAlphabet.length];
  return `${prefix}_${id}`;
}

export interface Store {
  state: FakeState;
  /** Records that the state changed; a file-backed store writes it soon after. */
  changed(): void;
  /** Writes any pending change now. */
  flush(): void;
}

export function createStore(stateFile?: string): Store {
  const loaded = stateFile && existsSync(stateFile) ? (JSON.parse(readFileSync(stateFile, 'utf8')) as Partial<FakeState>) : undefined;
  const state: FakeState = loaded?.version === 1 ? { ...emptyState(), ...loaded } : emptyState();
  let timer: NodeJS.Timeout | undefined;

  const write = () => {
    if (!stateFile) return;
    timer = undefined;
    mkdirSync(path.dirname(stateFile), { recursive: true });
    // Write then rename, so a crash mid-write never leaves half a file.
    const temporary = `${stateFile}.${process.pid}.tmp`;
    writeFileSync(temporary, JSON.stringify(state));
    renameSync(temporary, stateFile);
  };

  return {
    state,
    changed() {
      if (!stateFile || timer) return;
      timer = setTimeout(write, 100);
      timer.unref();
    },
    flush() {
      if (timer) clearTimeout(timer);
      write();
    },
  };
}
