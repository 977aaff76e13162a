import { layout, type EmailContext, type RenderedEmail } from './parts/layout';
import type { EmailTemplate } from './parts/template';
import { parseEmailPayload, type EmailPayloads, type EmailTemplateName, type ParsedEmailPayloads } from './payloads';
import { orderConfirmed } from './templates/order-confirmed';
import { passwordReset } from './templates/password-reset';
import { paymentFailed } from './templates/payment-failed';
import { renewalReminder } from './templates/renewal-reminder';
import { restDay } from './templates/rest-day';
import { roastDayMoved } from './templates/roast-day-moved';
import { roasted } from './templates/roasted';
import { shipped } from './templates/shipped';
import { staffInvitation } from './templates/staff-invitation';
import { subscriptionChanged } from './templates/subscription-changed';
import { subscriptionStarted } from './templates/subscription-started';

export type { EmailContext, RenderedEmail } from './parts/layout';

const templates: { [T in EmailTemplateName]: EmailTemplate<T> } = {
  'order-confirmed': orderConfirmed,
  'subscription-started': subscriptionStarted,
  roasted,
  shipped,
  'rest-day': restDay,
  'renewal-reminder': renewalReminder,
  'subscription-changed': subscriptionChanged,
  'payment-failed': paymentFailed,
  'password-reset': passwordReset,
  'staff-invitation': staffInvitation,
  'roast-day-moved': roastDayMoved,
};

/** A header-safe one-line subject. */
function oneLine(subject: string): string {
  return subject.replace(/[\r\n]+/g, ' ').trim();
}

/** The subject of an already-parsed payload (queueEmail stores it on the row). */
export function renderSubject<T extends EmailTemplateName>(template: T, payload: ParsedEmailPayloads[T]): string {
  return oneLine(templates[template].subject(payload));
}

/** Parses the payload against its template's schema (throws a ZodError when it does not fit) and renders. */
export function renderEmail<T extends EmailTemplateName>(template: T, payload: EmailPayloads[T] | unknown, context: EmailContext): RenderedEmail {
  const parsed = parseEmailPayload(template, payload);
  const definition = templates[template];
  return layout({ subject: oneLine(definition.subject(parsed)), ...definition.content(parsed, context) }, context);
}
