import { formatDay, greeting } from '../parts/format';
import type { Block } from '../parts/layout';
import { shopLink, type EmailTemplate } from '../parts/template';
import type { ParsedEmailPayloads } from '../payloads';

type Payload = ParsedEmailPayloads['subscription-changed'];

function subject(p: Payload): string {
  switch (p.change) {
    case 'changed':
      return 'Your Roasted to Order subscription is updated';
    case 'skipped':
      return p.nextDelivery ? `Delivery skipped: your next one roasts on ${formatDay(p.nextDelivery.roastDate)}` : 'Your delivery is skipped';
    case 'unskipped':
      return 'Your delivery is back on';
    case 'paused':
      return p.pausedUntil ? `Your subscription is paused until ${formatDay(p.pausedUntil)}` : 'Your subscription is paused';
    case 'resumed':
      return 'Your subscription is back on';
    case 'cancelled':
      return p.endsOn ? `Your subscription ends on ${formatDay(p.endsOn)}` : 'Your subscription is cancelled';
  }
}

function headline(p: Payload): { heading: string; text: string } {
  switch (p.change) {
    case 'changed':
      return { heading: 'Your subscription is updated', text: `We have saved your changes to your ${p.coffee} subscription.` };
    case 'skipped':
      // The notice says whether it was paid, and where its payment went.
      return { heading: 'Delivery skipped', text: p.notice ?? `We will not roast, ship or charge for the skipped ${p.coffee} delivery.` };
    case 'unskipped':
      return { heading: 'Your delivery is back on', text: p.notice ?? `Your skipped ${p.coffee} delivery is back on.` };
    case 'paused':
      return {
        heading: 'Your subscription is paused',
        text: p.notice
          ? `${p.notice} Your ${p.coffee} subscription picks up again by itself.`
          : p.pausedUntil
            ? `Your ${p.coffee} subscription is paused until ${formatDay(p.pausedUntil)}. We will not roast, ship or charge until then, and it picks up again by itself.`
            : `Your ${p.coffee} subscription is paused. We will not roast, ship or charge until you resume it.`,
      };
    case 'resumed':
      return { heading: 'Your subscription is back on', text: `Welcome back: your ${p.coffee} subscription is running again.` };
    case 'cancelled':
      return {
        heading: 'Your subscription is cancelled',
        text: p.endsOn
          ? `Your ${p.coffee} subscription ends on ${formatDay(p.endsOn)}. Deliveries already paid for still roast and ship, and we will not charge you again.`
          : `Your ${p.coffee} subscription is cancelled, and we will not charge you again.`,
      };
  }
}

export const subscriptionChanged: EmailTemplate<'subscription-changed'> = {
  subject,
  content(p, context) {
    const { heading, text } = headline(p);
    const blocks: Block[] = [
      { kind: 'paragraph', text: greeting(p.name) },
      { kind: 'paragraph', text },
    ];
    const lines = p.summary.filter((line) => line !== p.notice);
    if (lines.length > 0) blocks.push({ kind: 'address', title: 'What changed', lines });
    if (p.nextDelivery && p.change !== 'cancelled') {
      blocks.push(
        { kind: 'paragraph', text: 'Your next delivery:' },
        {
          kind: 'facts',
          rows: [
            ['Roast day', formatDay(p.nextDelivery.roastDate)],
            ['Ships', formatDay(p.nextDelivery.shipDate)],
            ['Ready to brew from', formatDay(p.nextDelivery.readyFrom)],
          ],
        },
      );
    }
    const button = p.change === 'cancelled' ? 'See your subscription' : 'Manage your subscription';
    blocks.push(
      // Deliveries, where the subscriber sees the schedule and changes it.
      { kind: 'button', label: button, url: shopLink(context, '/account/deliveries') },
      { kind: 'note', text: 'You get this e-mail whenever your subscription changes. If you did not make this change, please let us know.' },
    );
    return { heading, preheader: text, blocks };
  },
};
