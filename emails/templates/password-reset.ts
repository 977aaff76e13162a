import { formatInstant, greeting } from '../parts/format';
import type { EmailTemplate } from '../parts/template';

export const passwordReset: EmailTemplate<'password-reset'> = {
  subject: () => 'Reset your password',
  content(p, context) {
    return {
      heading: 'Choose a new password',
      preheader: 'A link to choose a new password for your account.',
      blocks: [
        { kind: 'paragraph', text: greeting(p.name) },
        { kind: 'paragraph', text: `Someone, hopefully you, asked to reset the password of your ${context.shop.name} account.` },
        { kind: 'button', label: 'Choose a new password', url: p.resetUrl },
        { kind: 'note', text: `The link works once and expires ${formatInstant(p.expiresAt, context.timeZone)}.` },
        { kind: 'note', text: 'If you did not ask for this, you can ignore this e-mail: your password stays as it is.' },
      ],
    };
  },
};
