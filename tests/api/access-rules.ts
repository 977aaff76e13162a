// Who may call each API route. tests/api/access-control.test.ts reads the app's own route list and
// fails for any route missing here (and for any rule naming no route): add a row with every new route.
import { randomUUID } from 'node:crypto';
import { createAddress, createJournalEntry, createLot, createOrder, createSubscription, type TestUser } from '../factories/index';

export type Access =
  /** Anyone, signed in or not. */
  | 'public'
  /** Any signed-in account, acting on its own data only (no record id in the path). */
  | 'signed-in'
  /** Any signed-in account, on a record it owns: customer A's record; customer B, staff and owner get 404 (or 403). */
  | 'own-record'
  /** The record's owner (customer A), and staff and owner; customer B and the packer get 404 (or 403). */
  | 'own-or-staff'
  /** The record's owner (customer A), and the packer, staff and owner (reading an order); customer B gets 404 (or 403). */
  | 'own-or-team'
  /** The packer, staff and owner: the Pack List, shipping and reading orders. */
  | 'packing'
  /** Staff and owner. */
  | 'staff'
  /** The owner only. */
  | 'owner'
  /** No session: the request proves itself (e.g. a Stripe signature), so without that proof it never gets a 2xx. */
  | 'signed-request';

export interface AccessRule {
  method: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  /** As mounted, with Express parameters: `/api/account/addresses/:id`. */
  path: string;
  access: Access;
  /**
   * `own-record`, `own-or-staff` and `own-or-team`: makes a record owned by `owner` (customer A) and returns the
   * path's parameters. Other rules get a random UUID for every parameter unless `params` says otherwise.
   */
  record?: (owner: TestUser) => Promise<Record<string, string>>;
  params?: Record<string, string>;
  /** A body sent by every caller (none by default: an allowed caller may then get a 400, never a 401 or 403). */
  body?: Record<string, unknown>;
}

async function addressOf(owner: TestUser) {
  return { id: (await createAddress(owner)).id };
}

/** A green order awaiting payment ($18.99 and $6.95 shipping, no lines). */
async function orderOf(owner: TestUser) {
  return { id: (await createOrder({ userId: owner.id, subtotalCents: 1899, shippingCents: 695 })).id };
}

/** A paid green order: its owner reaches it (and is told it is not waiting for payment), no one else does. */
async function paidOrderOf(owner: TestUser) {
  return { id: (await createOrder({ userId: owner.id, status: 'paid', subtotalCents: 1899, shippingCents: 695 })).id };
}

/** An active Roaster's Rotation subscription whose deliveries start in 2031 (nothing about it is locked). */
async function subscriptionOf(owner: TestUser) {
  return { id: (await createSubscription({ userId: owner.id, status: 'active', priceCents: 3200, anchorDate: '2031-01-07' })).id };
}

/** The invented lot every access-test journal entry is of (made on first use). */
const journalLotCode = `JRNL-${randomUUID().slice(0, 8).toUpperCase()}`;
let journalLot: Promise<{ id: string }> | undefined;

/** A Roast Journal entry (a popper roast of the invented lot). */
async function journalEntryOf(owner: TestUser) {
  journalLot ??= createLot({ code: journalLotCode });
  return { id: await createJournalEntry(owner.id, (await journalLot).id) };
}

export const accessRules: AccessRule[] = [
  { method: 'GET', path: '/api/health', access: 'public' },
  { method: 'POST', path: '/api/payments/webhook', access: 'signed-request' },

  { method: 'POST', path: '/api/auth/sign-up', access: 'public' },
  { method: 'POST', path: '/api/auth/sign-in', access: 'public' },
  { method: 'POST', path: '/api/auth/sign-out', access: 'public' },
  { method: 'GET', path: '/api/auth/me', access: 'public' },
  { method: 'POST', path: '/api/auth/password-reset', access: 'public' },
  { method: 'POST', path: '/api/auth/password-reset/confirm', access: 'public' },
  { method: 'POST', path: '/api/auth/invitations/preview', access: 'public' },
  { method: 'POST', path: '/api/auth/invitations/accept', access: 'public' },

  { method: 'PATCH', path: '/api/account/profile', access: 'signed-in' },
  { method: 'PUT', path: '/api/account/email', access: 'signed-in' },
  { method: 'PUT', path: '/api/account/password', access: 'signed-in' },
  { method: 'GET', path: '/api/account/addresses', access: 'signed-in' },
  { method: 'POST', path: '/api/account/addresses', access: 'signed-in' },
  {
    method: 'PUT',
    path: '/api/account/addresses/:id',
    access: 'own-record',
    record: addressOf,
    body: { name: 'Changed', line1: '1 Other Road', city: 'Greyhaven', region: 'WA', postalCode: '98201' },
  },
  { method: 'DELETE', path: '/api/account/addresses/:id', access: 'own-record', record: addressOf },

  { method: 'GET', path: '/api/owner/team', access: 'owner' },
  { method: 'POST', path: '/api/owner/team', access: 'owner' },
  { method: 'PATCH', path: '/api/owner/team/:id', access: 'owner' },
  { method: 'DELETE', path: '/api/owner/team/invitations/:id', access: 'owner' },
  { method: 'GET', path: '/api/owner/ledger', access: 'owner' },
  { method: 'GET', path: '/api/owner/ledger/sales.csv', access: 'owner' },
  { method: 'GET', path: '/api/owner/ledger/subscriptions.csv', access: 'owner' },
  { method: 'GET', path: '/api/owner/ledger/green.csv', access: 'owner' },
  { method: 'GET', path: '/api/owner/ledger/loss.csv', access: 'owner' },

  { method: 'GET', path: '/api/lots', access: 'public' },
  { method: 'GET', path: '/api/shipping', access: 'public' },
  { method: 'GET', path: '/api/lots/:code', access: 'public' },
  { method: 'GET', path: '/api/lots/:code/roast-guide', access: 'public' },
  { method: 'GET', path: '/api/lots/:code/home-roasts', access: 'public' },
  { method: 'POST', path: '/api/lots', access: 'staff' },
  { method: 'PATCH', path: '/api/lots/:code', access: 'staff' },
  { method: 'POST', path: '/api/lots/:code/photos', access: 'staff' },
  { method: 'DELETE', path: '/api/lots/:code/photos/:id', access: 'staff' },
  { method: 'POST', path: '/api/lots/:code/spec-sheet', access: 'staff' },
  { method: 'POST', path: '/api/lots/:code/stock-adjustments', access: 'staff' },
  { method: 'GET', path: '/api/lots/:code/stock-movements', access: 'staff' },
  { method: 'GET', path: '/api/roastery/green-stock', access: 'staff' },
  { method: 'GET', path: '/api/roastery/green-stock/:code', access: 'staff' },
  { method: 'GET', path: '/api/uploads/:id', access: 'public' },

  { method: 'GET', path: '/api/roastery/outbox', access: 'staff' },
  { method: 'GET', path: '/api/roastery/today', access: 'staff' },
  { method: 'GET', path: '/api/roastery/planning', access: 'staff' },
  { method: 'GET', path: '/api/roastery/planning.csv', access: 'staff' },

  { method: 'GET', path: '/api/roastery/settings', access: 'packing' },
  { method: 'PUT', path: '/api/roastery/settings', access: 'owner' },
  { method: 'GET', path: '/api/roastery/calendar', access: 'staff' },
  { method: 'PUT', path: '/api/roastery/calendar/:date', access: 'staff', params: { date: '2026-12-08' } },
  { method: 'GET', path: '/api/roastery/days/:date/roast-list', access: 'staff', params: { date: '2026-12-08' } },
  { method: 'GET', path: '/api/roastery/days/:date/roast-list.csv', access: 'staff', params: { date: '2026-12-08' } },
  { method: 'GET', path: '/api/roastery/days/:date/roast-list.pdf', access: 'staff', params: { date: '2026-12-08' } },
  { method: 'POST', path: '/api/roastery/batches', access: 'staff' },
  { method: 'GET', path: '/api/roastery/days/:date/batches', access: 'staff', params: { date: '2026-12-08' } },

  { method: 'POST', path: '/api/checkout/green', access: 'signed-in' },
  { method: 'GET', path: '/api/orders', access: 'signed-in' },
  { method: 'GET', path: '/api/orders.csv', access: 'packing' },
  { method: 'GET', path: '/api/orders/:id', access: 'own-or-team', record: orderOf },
  { method: 'POST', path: '/api/orders/:id/pay', access: 'own-record', record: paidOrderOf },
  { method: 'POST', path: '/api/orders/:id/discard', access: 'own-record', record: orderOf },

  { method: 'GET', path: '/api/subscriptions/preview', access: 'public' },
  { method: 'POST', path: '/api/checkout/subscription', access: 'signed-in' },
  { method: 'GET', path: '/api/subscriptions', access: 'signed-in' },
  { method: 'GET', path: '/api/subscriptions/:id', access: 'own-record', record: subscriptionOf },
  { method: 'GET', path: '/api/subscriptions/:id/deliveries', access: 'own-record', record: subscriptionOf },
  { method: 'PATCH', path: '/api/subscriptions/:id', access: 'own-or-staff', record: subscriptionOf, body: { grind: 'pour-over' } },
  { method: 'POST', path: '/api/subscriptions/:id/skip', access: 'own-or-staff', record: subscriptionOf },
  { method: 'POST', path: '/api/subscriptions/:id/deliveries/:date/skip', access: 'own-or-staff', record: subscriptionOf, params: { date: '2031-01-22' } },
  { method: 'POST', path: '/api/subscriptions/:id/deliveries/:date/unskip', access: 'own-or-staff', record: subscriptionOf, params: { date: '2031-01-22' } },
  { method: 'POST', path: '/api/subscriptions/:id/pause', access: 'own-or-staff', record: subscriptionOf, body: { until: '2031-03-03' } },
  { method: 'POST', path: '/api/subscriptions/:id/resume', access: 'own-or-staff', record: subscriptionOf },
  { method: 'POST', path: '/api/subscriptions/:id/cancel', access: 'own-or-staff', record: subscriptionOf },
  { method: 'POST', path: '/api/subscriptions/:id/pay', access: 'own-record', record: subscriptionOf },
  { method: 'POST', path: '/api/subscriptions/:id/discard', access: 'own-record', record: subscriptionOf },
  { method: 'GET', path: '/api/roastery/subscribers', access: 'staff' },
  { method: 'GET', path: '/api/roastery/subscribers.csv', access: 'staff' },
  { method: 'GET', path: '/api/roastery/subscribers/:id', access: 'staff' },
  { method: 'GET', path: '/api/roastery/rotation', access: 'staff' },
  { method: 'PUT', path: '/api/roastery/rotation/:date', access: 'staff', params: { date: '2031-01-06' } },
  { method: 'POST', path: '/api/orders/:id/pack', access: 'packing' },
  { method: 'POST', path: '/api/orders/:id/ship', access: 'packing', body: { carrier: 'Invented Parcel Co', trackingNumber: 'TEST123' } },
  { method: 'POST', path: '/api/orders/:id/refund', access: 'owner' },
  { method: 'POST', path: '/api/orders/:id/cancel', access: 'staff' },
  { method: 'POST', path: '/api/orders/:id/resend/:template', access: 'staff', params: { template: 'order-confirmed' } },
  { method: 'PATCH', path: '/api/orders/:id/address', access: 'staff' },
  { method: 'PUT', path: '/api/orders/:id/note', access: 'staff', body: { note: 'Leave with the neighbour.' } },
  { method: 'GET', path: '/api/orders/:id/trace', access: 'staff' },

  { method: 'GET', path: '/api/journal', access: 'signed-in' },
  { method: 'POST', path: '/api/journal', access: 'signed-in' },
  { method: 'GET', path: '/api/journal.csv', access: 'signed-in' },
  {
    method: 'PUT',
    path: '/api/journal/:id',
    access: 'own-record',
    record: journalEntryOf,
    body: { lotCode: journalLotCode, device: 'popper', greenGrams: 80, roastedGrams: 68, endSeconds: 205 },
  },
  { method: 'DELETE', path: '/api/journal/:id', access: 'own-record', record: journalEntryOf },
  { method: 'GET', path: '/api/roastery/lots/:code/journal-summary', access: 'staff', params: { code: 'ANY-LOT' } },
  { method: 'GET', path: '/api/roastery/days/:date/pack-list', access: 'packing', params: { date: '2026-12-08' } },
  { method: 'GET', path: '/api/roastery/days/:date/labels.pdf', access: 'packing', params: { date: '2026-12-08' } },
  { method: 'POST', path: '/api/roastery/days/:date/ship', access: 'packing', params: { date: '2026-12-08' } },
  { method: 'GET', path: '/api/roastery/batches/:id/trace', access: 'staff' },
];
