import { bagLabel, formatDay, grindLabel, greeting, levelLabel } from '../parts/format';
import { addressLines } from '../../shared/domain/address';
import { formatMoney } from '../../shared/domain/money';
import { orderReference } from '../../shared/domain/order-reference';
import type { Block } from '../parts/layout';
import { shopLink, type EmailTemplate } from '../parts/template';
import type { ParsedEmailPayloads } from '../payloads';

type Line = ParsedEmailPayloads['order-confirmed']['lines'][number];

export function lineDetail(line: Pick<Line, 'quantity' | 'size' | 'roastLevel' | 'grind'>): string {
  return [`${line.quantity} × ${bagLabel(line.size)}`, line.roastLevel && `${levelLabel(line.roastLevel)} roast`, line.grind && grindLabel(line.grind)]
    .filter(Boolean)
    .join(' · ');
}

export const orderConfirmed: EmailTemplate<'order-confirmed'> = {
  subject: (p) => (p.kind === 'green' ? 'Your green coffee order is confirmed' : 'Your coffee order is confirmed'),
  content(p, context) {
    const blocks: Block[] = [{ kind: 'paragraph', text: greeting(p.name) }];
    if (p.kind === 'roasted' && p.roastDate) {
      blocks.push({
        kind: 'paragraph',
        text: `Thank you: your payment went through. We will roast your coffee on ${formatDay(p.roastDate)}${p.shipDate ? ` and ship it on ${formatDay(p.shipDate)}` : ''}, once it has rested in the bag.`,
      });
    } else {
      blocks.push({
        kind: 'paragraph',
        text: 'Thank you: your payment went through. We will weigh out and pack your order, and e-mail you the tracking number when it ships.',
      });
    }
    if (p.lines.length > 0) {
      const totals: [string, string][] = [];
      if (p.subtotalCents !== undefined) totals.push(['Subtotal', formatMoney(p.subtotalCents, p.currency)]);
      if (p.shippingCents !== undefined) totals.push(['Shipping', p.shippingCents === 0 ? 'Free' : formatMoney(p.shippingCents, p.currency)]);
      totals.push(['Total', formatMoney(p.totalCents, p.currency)]);
      blocks.push({
        kind: 'lines',
        rows: p.lines.map((line) => ({
          description: line.description,
          detail: lineDetail(line),
          ...(line.lineTotalCents !== undefined ? { amount: formatMoney(line.lineTotalCents, p.currency) } : {}),
        })),
        totals,
      });
    } else {
      blocks.push({ kind: 'facts', rows: [['Total', formatMoney(p.totalCents, p.currency)]] });
    }
    blocks.push({ kind: 'facts', rows: [['Order', orderReference(p.orderId)]] });
    if (p.shipTo) {
      blocks.push({ kind: 'address', title: 'Shipping to', lines: addressLines(p.shipTo) });
    }
    blocks.push({ kind: 'button', label: 'See your order', url: shopLink(context, `/orders/${encodeURIComponent(p.orderId)}`) });
    return { heading: 'Your order is confirmed', preheader: `Order ${orderReference(p.orderId)}: ${formatMoney(p.totalCents, p.currency)}, paid.`, blocks };
  },
};
