import nodemailer from 'nodemailer';
import type { Config } from '../config';

export interface OutgoingEmail {
  to: string;
  subject: string;
  html: string;
  text: string;
  /** A stable id for this message (the outbox row's id): a re-send after a crash carries the same Message-ID. */
  messageKey: string;
}

export interface Mailer {
  /** Hands the message to the SMTP server; resolves once the server accepted it. Throws a MailError otherwise. */
  send(message: OutgoingEmail): Promise<void>;
  close(): void;
}

/**
 * Why a message was not accepted. `permanent` (a 5xx reply such as "no such mailbox") means
 * trying again will not help; anything else (the server down, a timeout, a 4xx) may pass later.
 */
export class MailError extends Error {
  constructor(
    message: string,
    readonly permanent: boolean,
    readonly code?: string,
    readonly responseCode?: number,
  ) {
    super(message);
    this.name = 'MailError';
  }
}

function domainOf(from: string): string {
  const address = /<([^>]+)>/.exec(from)?.[1] ?? from;
  return address.split('@')[1]?.trim() || 'restday.local';
}

/**
 * nodemailer over SMTP from config.SMTP_URL (maildev on loopback in development and tests; the
 * production relay's URL, credentials included, from the environment). One connection per message:
 * a shop's volume is small, and a fresh connection never inherits a broken one after an outage.
 */
export function createMailer(config: Pick<Config, 'SMTP_URL' | 'MAIL_FROM'>, timeouts = { connectMs: 10_000, socketMs: 30_000 }): Mailer {
  const transport = nodemailer.createTransport({
    url: config.SMTP_URL,
    connectionTimeout: timeouts.connectMs,
    greetingTimeout: timeouts.connectMs,
    socketTimeout: timeouts.socketMs,
  });
  const messageDomain = domainOf(config.MAIL_FROM);
  return {
    async send(message) {
      try {
        await transport.sendMail({
          from: config.MAIL_FROM,
          to: message.to,
          subject: message.subject,
          html: message.html,
          text: message.text,
          messageId: `<${message.messageKey}@${messageDomain}>`,
          headers: { 'X-Restday-Outbox-Id': message.messageKey },
        });
      } catch (error) {
        const failure = error as { message?: string; code?: string; responseCode?: number; permanent?: boolean };
        const permanent = failure.permanent === true || (typeof failure.responseCode === 'number' && failure.responseCode >= 500);
        throw new MailError(failure.message ?? String(error), permanent, failure.code, failure.responseCode);
      }
    },
    close() {
      transport.close();
    },
  };
}
