import { formatDay, greeting } from '../parts/format';
import type { Block } from '../parts/layout';
import { orderReference } from '../../shared/domain/order-reference';
import { type EmailTemplate } from '../parts/template';

export const restDay: EmailTemplate<'rest-day'> = {
  subject: () => 'Your coffee is ready to brew',
  content(p) {
    const coffee = p.coffee ? `your ${p.coffee}` : 'your coffee';
    const blocks: Block[] = [
      { kind: 'paragraph', text: greeting(p.name) },
      {
        kind: 'paragraph',
        text: `Today is the rest day: ${coffee} has rested long enough to brew at its best${p.brewMethod === 'espresso' ? ' as espresso, which asks for the longer rest' : ''}.`,
      },
    ];
    const rows: [string, string][] = [
      ['Order', orderReference(p.orderId)],
      ['Ready to brew from', formatDay(p.readyFrom)],
    ];
    if (p.bestBefore) rows.push(['Best before', formatDay(p.bestBefore)]);
    blocks.push({ kind: 'facts', rows }, { kind: 'note', text: 'Keep the bag closed between brews, away from heat and light.' });
    return { heading: 'Ready to brew', preheader: `Ready from ${formatDay(p.readyFrom)}.`, blocks };
  },
};
