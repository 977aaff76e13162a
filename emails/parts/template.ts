import type { EmailTemplateName, ParsedEmailPayloads } from '../payloads';
import type { EmailContent, EmailContext } from './layout';

/** One message: its subject (from the payload alone, so it is fixed when the row is queued) and its body. */
export interface EmailTemplate<T extends EmailTemplateName> {
  subject(payload: ParsedEmailPayloads[T]): string;
  content(payload: ParsedEmailPayloads[T], context: EmailContext): Omit<EmailContent, 'subject'>;
}

/** Absolute link to a page of the shop. */
export function shopLink(context: EmailContext, path: string): string {
  return `${context.baseUrl.replace(/\/+$/, '')}${path}`;
}
