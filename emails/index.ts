/**
 * Restday's e-mail templates. Each is a pure function from a typed payload (plus the shop's
 * details) to `{subject, html, text}`; nothing here sends anything. The server writes an outbox row
 * with `queueEmail` (server/modules/outbox/outbox.repo.ts) and the relay renders and sends it.
 */
export {
  emailPayloadSchemas,
  emailTemplateNames,
  isEmailTemplateName,
  parseEmailPayload,
  subscriptionChangeKinds,
  type EmailPayloads,
  type EmailTemplateName,
  type ParsedEmailPayloads,
} from './payloads';
export { renderEmail, renderSubject, type EmailContext, type RenderedEmail } from './render';
