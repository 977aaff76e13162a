import { formatDay, greeting } from '../parts/format';
import type { Block } from '../parts/layout';
import { orderReference } from '../../shared/domain/order-reference';
import { type EmailTemplate } from '../parts/template';
import { lineDetail } from './order-confirmed';

export const roasted: EmailTemplate<'roasted'> = {
  subject: () => 'Your coffee has been roasted',
  content(p) {
    const blocks: Block[] = [
      { kind: 'paragraph', text: greeting(p.name) },
      {
        kind: 'paragraph',
        text: `We roasted your coffee on ${formatDay(p.roastDate)}. It is resting in its bag now: the one-way valve lets the carbon dioxide out while the flavour settles.`,
      },
    ];
    if (p.lines.length > 0) blocks.push({ kind: 'lines', rows: p.lines.map((line) => ({ description: line.description, detail: lineDetail(line) })) });
    const rows: [string, string][] = [['Order', orderReference(p.orderId)]];
    if (p.shipDate) rows.push(['Ships', formatDay(p.shipDate)]);
    if (p.readyFrom) rows.push(['Ready to brew from', formatDay(p.readyFrom)]);
    blocks.push({ kind: 'facts', rows });
    return { heading: 'Roasted today, resting now', preheader: `Roasted ${formatDay(p.roastDate)}.`, blocks };
  },
};
