import { bagLabel, cadenceLabel, formatDay, grindLabel, greeting, levelLabel } from '../parts/format';
import { formatMoney } from '../../shared/domain/money';
import type { Block } from '../parts/layout';
import { shopLink, type EmailTemplate } from '../parts/template';

export const subscriptionStarted: EmailTemplate<'subscription-started'> = {
  subject: () => 'Your Roasted to Order subscription has started',
  content(p, context) {
    const rows: [string, string][] = [['Coffee', p.coffee]];
    if (p.roastLevel) rows.push(['Roast level', levelLabel(p.roastLevel)]);
    rows.push(['Bag', bagLabel(p.size)], ['Grind', grindLabel(p.grind)], ['Brewing for', p.brewMethod === 'espresso' ? 'Espresso' : 'Filter']);
    rows.push(['Delivery', cadenceLabel(p.cadenceWeeks)], ['Each delivery', formatMoney(p.priceCents, p.currency)]);
    if (p.firstRoastDate) rows.push(['First roast day', formatDay(p.firstRoastDate)]);
    const blocks: Block[] = [
      { kind: 'paragraph', text: greeting(p.name) },
      {
        kind: 'paragraph',
        text: 'Welcome to Roasted to Order. We roast each delivery on a roast day, let it rest, then ship it: every delivery e-mail tells you the day it is ready to brew.',
      },
      { kind: 'facts', rows },
      { kind: 'paragraph', text: 'You can skip a delivery, pause, change your coffee or cancel at any time from your account.' },
      { kind: 'button', label: 'Manage your subscription', url: shopLink(context, '/account') },
    ];
    return { heading: 'Your subscription has started', preheader: `${p.coffee}, ${cadenceLabel(p.cadenceWeeks)}.`, blocks };
  },
};
