import { formatInstant } from '../parts/format';
import type { EmailTemplate } from '../parts/template';

export const staffInvitation: EmailTemplate<'staff-invitation'> = {
  subject: () => 'You are invited to the Roastery',
  content(p, context) {
    const who = p.invitedByName || 'The owner';
    const as = { owner: 'an owner', staff: 'a member of staff', packer: 'a packer' }[p.role];
    return {
      heading: 'Join the Roastery',
      preheader: `${who} invited you to ${context.shop.name}.`,
      blocks: [
        { kind: 'paragraph', text: 'Hello,' },
        {
          kind: 'paragraph',
          text: `${who} invited you to join ${context.shop.name} as ${as}. The Roastery is where the team plans roast days, records batches and packs orders.`,
        },
        { kind: 'button', label: 'Accept the invitation', url: p.acceptUrl },
        {
          kind: 'note',
          text: `The invitation expires ${formatInstant(p.expiresAt, context.timeZone)}. If you were not expecting it, you can ignore this e-mail.`,
        },
      ],
    };
  },
};
