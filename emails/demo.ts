/**
 * Demo payloads for every template (all invented: the shop, its customers and lots are the demo
 * scenario's). Used by `npm run emails:preview` and by the template tests.
 */
import type { EmailContext } from './parts/layout';
import type { EmailPayloads, EmailTemplateName } from './payloads';

export const demoEmailContext: EmailContext = {
  shop: { name: 'Wrenfield Roastworks', postalAddress: '12 Old Mill Way\nWrenfield, CO 81640\nUnited States' },
  baseUrl: 'http://127.0.0.1:3000',
  timeZone: 'America/Denver',
};

const orderId = '5d1c2b7e-9a41-4c3e-8f0a-2b6d9e1f4a70';
const subscriptionId = 'a3f0c8d2-61b4-4e57-9c2a-7d8e5f1b0c94';

export const demoEmailPayloads: { [T in EmailTemplateName]: EmailPayloads[T] } = {
  'order-confirmed': {
    name: 'Robin Alder',
    orderId,
    kind: 'green',
    lines: [
      { description: 'Keraba Ridge (WR-24-ETH-01)', size: '1lb', quantity: 2, lineTotalCents: 2640 },
      { description: 'Piedra Azulada (WR-24-GTM-01)', size: '8oz', quantity: 1, lineTotalCents: 725 },
    ],
    subtotalCents: 3365,
    shippingCents: 895,
    totalCents: 4260,
    currency: 'usd',
    shipTo: { name: 'Robin Alder', line1: '418 Larkspur Lane', city: 'Cinder Hollow', region: 'CO', postalCode: '81522', country: 'United States' },
  },
  'subscription-started': {
    name: 'Robin Alder',
    subscriptionId,
    coffee: "Roaster's Rotation",
    size: '12oz',
    roastLevel: 'medium',
    grind: 'pour-over',
    brewMethod: 'filter',
    cadenceWeeks: 2,
    priceCents: 1950,
    currency: 'usd',
    firstRoastDate: '2026-12-08',
  },
  roasted: {
    name: 'Robin Alder',
    orderId,
    roastDate: '2026-12-08',
    lines: [{ description: 'Keraba Ridge', size: '12oz', quantity: 1, roastLevel: 'light', grind: 'whole-bean' }],
    shipDate: '2026-12-09',
    readyFrom: '2026-12-10',
  },
  shipped: {
    name: 'Robin Alder',
    orderId,
    kind: 'roasted',
    carrier: 'Kestrel Post',
    trackingNumber: '9400 1000 0000 0000 0000 00',
    trackingUrl: 'https://track.example.com/parcel/9400100000000000000000',
    readyFrom: '2026-12-10',
    bestBefore: '2027-01-05',
    expectedArrival: '2026-12-10',
    readyOnArrival: true,
  },
  'rest-day': {
    name: 'Robin Alder',
    orderId,
    readyFrom: '2026-12-10',
    brewMethod: 'filter',
    coffee: 'Keraba Ridge',
    bestBefore: '2027-01-05',
  },
  'renewal-reminder': {
    name: 'Robin Alder',
    subscriptionId,
    coffee: "Roaster's Rotation",
    renewsOn: '2026-12-21',
    amountCents: 1950,
    currency: 'usd',
  },
  'subscription-changed': {
    name: 'Robin Alder',
    subscriptionId,
    coffee: "Roaster's Rotation",
    change: 'changed',
    summary: ['Roast level: Medium-dark', 'Grind: Whole bean', 'Delivery: every 3 weeks'],
    nextDelivery: { roastDate: '2026-12-16', shipDate: '2026-12-17', readyFrom: '2026-12-18' },
  },
  'payment-failed': {
    name: 'Robin Alder',
    amountCents: 1950,
    currency: 'usd',
    subscriptionId,
    nextAttemptOn: '2026-12-24',
  },
  'password-reset': {
    name: 'Robin Alder',
    resetUrl: 'http://127.0.0.1:3000/reset-password?token=demo-token-not-real',
    expiresAt: '2026-12-08T17:30:00.000Z',
  },
  'staff-invitation': {
    invitedByName: 'Maren Atwood',
    role: 'staff',
    acceptUrl: 'http://127.0.0.1:3000/accept-invitation?token=demo-token-not-real',
    expiresAt: '2026-12-15T17:30:00.000Z',
  },
  'roast-day-moved': {
    name: 'Robin Alder',
    closedDate: '2026-12-24',
    items: [{ orderId, coffee: 'Keraba Ridge', roastDate: '2026-12-28', shipDate: '2026-12-29', readyFrom: '2026-12-30', bestBefore: '2027-01-25' }],
  },
};
