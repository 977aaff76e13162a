import { formatDay, greeting } from '../parts/format';
import type { Block } from '../parts/layout';
import { orderReference } from '../../shared/domain/order-reference';
import { type EmailTemplate } from '../parts/template';

/** Sent when the shop closes a roast day: the customer's coffee roasts on a later day, with its new dates. */
export const roastDayMoved: EmailTemplate<'roast-day-moved'> = {
  subject: (p) => (p.items.length === 1 ? 'Your coffee will roast on a new day' : 'Your coffee will roast on new days'),
  content(p) {
    const blocks: Block[] = [
      { kind: 'paragraph', text: greeting(p.name) },
      {
        kind: 'paragraph',
        text: `We are not roasting on ${formatDay(p.closedDate)}, so we moved your coffee to our next roast day. It is still roasted to order; only the dates change.`,
      },
    ];
    for (const item of p.items) {
      const rows: [string, string][] = [];
      if (item.orderId) rows.push(['Order', orderReference(item.orderId)]);
      rows.push(
        ['Coffee', item.coffee],
        ['Roast date', formatDay(item.roastDate)],
        ['Ships', formatDay(item.shipDate)],
        ['Ready to brew from', formatDay(item.readyFrom)],
        ['Best before', formatDay(item.bestBefore)],
      );
      blocks.push({ kind: 'facts', rows });
    }
    blocks.push({ kind: 'note', text: 'You do not need to do anything. Reply to this e-mail if the new dates do not suit you.' });
    const first = p.items[0];
    return {
      heading: 'New roast date',
      preheader: first ? `Now roasting ${formatDay(first.roastDate)}.` : `No roasting on ${formatDay(p.closedDate)}.`,
      blocks,
    };
  },
};
