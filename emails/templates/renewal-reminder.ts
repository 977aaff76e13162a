import { formatDay, greeting } from '../parts/format';
import { formatMoney } from '../../shared/domain/money';
import { shopLink, type EmailTemplate } from '../parts/template';

export const renewalReminder: EmailTemplate<'renewal-reminder'> = {
  subject: (p) => `Your next delivery renews on ${formatDay(p.renewsOn)}`,
  content(p, context) {
    return {
      heading: 'Your next delivery is coming up',
      preheader: `${p.coffee}: ${formatMoney(p.amountCents, p.currency)} on ${formatDay(p.renewsOn)}.`,
      blocks: [
        { kind: 'paragraph', text: greeting(p.name) },
        {
          kind: 'paragraph',
          text: `Your Roasted to Order subscription for ${p.coffee} renews on ${formatDay(p.renewsOn)}, when we will charge ${formatMoney(p.amountCents, p.currency)} to your card.`,
        },
        { kind: 'paragraph', text: 'Until then you can skip this delivery, pause, or change your coffee, roast level, bag size or grind.' },
        { kind: 'button', label: 'Manage your subscription', url: shopLink(context, '/account') },
      ],
    };
  },
};
