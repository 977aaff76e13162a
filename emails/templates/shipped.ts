import { formatDay, greeting } from '../parts/format';
import type { Block } from '../parts/layout';
import { orderReference } from '../../shared/domain/order-reference';
import { shopLink, type EmailTemplate } from '../parts/template';

export const shipped: EmailTemplate<'shipped'> = {
  subject: (p) => (p.kind === 'green' ? 'Your green coffee is on its way' : 'Your coffee is on its way'),
  content(p, context) {
    const rows: [string, string][] = [
      ['Order', orderReference(p.orderId)],
      ['Carrier', p.carrier],
      ['Tracking number', p.trackingNumber],
    ];
    if (p.expectedArrival) rows.push(['Expected to arrive', formatDay(p.expectedArrival)]);
    if (p.readyFrom) rows.push(['Ready to brew from', formatDay(p.readyFrom)]);
    if (p.bestBefore) rows.push(['Best before', formatDay(p.bestBefore)]);
    const blocks: Block[] = [
      { kind: 'paragraph', text: greeting(p.name) },
      { kind: 'paragraph', text: 'Your parcel has left the roastery.' },
      { kind: 'facts', rows },
    ];
    if (p.trackingUrl) blocks.push({ kind: 'button', label: 'Track your parcel', url: p.trackingUrl });
    blocks.push({ kind: 'button', label: 'See your order', url: shopLink(context, `/orders/${encodeURIComponent(p.orderId)}`) });
    if (p.readyFrom && p.readyOnArrival) {
      blocks.push({
        kind: 'paragraph',
        text: `Freshly roasted coffee brews best after a rest. We held yours after roasting so that it is ready to brew when it arrives.`,
      });
    } else if (p.readyFrom) {
      blocks.push({
        kind: 'paragraph',
        text: `Freshly roasted coffee brews best after a rest, so yours may arrive before it is at its best. It is ready from ${formatDay(p.readyFrom)}: we will send you a note that morning.`,
      });
    } else if (p.kind === 'green') {
      blocks.push({ kind: 'paragraph', text: 'Keep green coffee somewhere cool, dry and dark, in its bag, until you roast it.' });
    }
    return { heading: 'On its way', preheader: `${p.carrier} tracking number ${p.trackingNumber}.`, blocks };
  },
};
