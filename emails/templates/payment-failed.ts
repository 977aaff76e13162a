import { formatDay, greeting } from '../parts/format';
import { formatMoney } from '../../shared/domain/money';
import { orderReference } from '../../shared/domain/order-reference';
import type { Block } from '../parts/layout';
import { shopLink, type EmailTemplate } from '../parts/template';

export const paymentFailed: EmailTemplate<'payment-failed'> = {
  subject: () => 'We could not take your payment',
  content(p, context) {
    const what = p.subscriptionId ? 'for your Roasted to Order subscription' : p.orderId ? `for order ${orderReference(p.orderId)}` : '';
    const blocks: Block[] = [
      { kind: 'paragraph', text: greeting(p.name) },
      { kind: 'paragraph', text: `We tried to charge ${formatMoney(p.amountCents, p.currency)}${what ? ` ${what}` : ''}, and the payment did not go through.` },
    ];
    if (p.subscriptionId) blocks.push({ kind: 'paragraph', text: 'We are holding your next delivery until the payment goes through.' });
    if (p.nextAttemptOn) blocks.push({ kind: 'paragraph', text: `We will try your card again on ${formatDay(p.nextAttemptOn)}.` });
    blocks.push({ kind: 'button', label: 'Update your card', url: p.updatePaymentUrl ?? shopLink(context, '/account') });
    return { heading: 'Your payment did not go through', preheader: `${formatMoney(p.amountCents, p.currency)} was declined.`, blocks };
  },
};
