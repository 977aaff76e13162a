import { createHmac } from 'node:crypto';

/**
 * The `Stripe-Signature` header for a webhook body: `t=<unix seconds>,v1=<hex HMAC-SHA256 of
 * "<t>.<body>" keyed with the whole whsec_ secret>`, as stripe-node's `webhooks.constructEvent` checks it.
 */
export function signatureHeader(payload: string, secret: string, timestampSeconds: number): string {
  const signature = createHmac('sha256', secret).update(`${timestampSeconds}.${payload}`, 'utf8').digest('hex');
  return `t=${timestampSeconds},v1=${signature}`;
}
