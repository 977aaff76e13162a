import { describe, expect, it } from 'vitest';
import { ZodError } from 'zod';
import { demoEmailContext, demoEmailPayloads } from '../../emails/demo';
import { emailPayloadSchemas, emailTemplateNames, renderEmail, type EmailContext, type EmailPayloads, type EmailTemplateName } from '../../emails/index';

const hostile = '<script>alert("x")</script> & Bobby\'s "tables"';
const hostileContext: EmailContext = {
  shop: { name: 'Wrenfield <b>Roastworks</b>', postalAddress: '12 Old Mill Way\nWrenfield, CO 81640 <img src=x>' },
  baseUrl: 'http://127.0.0.1:3000',
  timeZone: 'America/Denver',
};

/** The demo payload with every free-text field a customer or staff member could type made hostile. */
function hostilePayload<T extends EmailTemplateName>(template: T): EmailPayloads[T] {
  const payload = structuredClone(demoEmailPayloads[template]) as Record<string, unknown>;
  for (const key of ['name', 'invitedByName', 'coffee', 'carrier', 'trackingNumber']) if (key in payload) payload[key] = hostile;
  if (Array.isArray(payload.lines)) payload.lines = (payload.lines as object[]).map((line) => ({ ...line, description: hostile }));
  if (payload.shipTo) payload.shipTo = { ...(payload.shipTo as object), name: hostile, line1: hostile };
  return payload as EmailPayloads[T];
}

describe.each(emailTemplateNames)('the %s e-mail', (template) => {
  it('renders the demo payload as HTML and plain text with a subject', () => {
    const email = renderEmail(template, demoEmailPayloads[template], demoEmailContext);
    expect(email.subject.length).toBeGreaterThan(5);
    expect(email.subject).not.toMatch(/[\r\n]/);
    expect(email.html).toMatch(/^<!doctype html>/);
    expect(email.text.length).toBeGreaterThan(50);
    expect(email.text).not.toMatch(/<[a-z]/i);
  });

  it("carries the shop's name and postal address in the footer of both parts", () => {
    const email = renderEmail(template, demoEmailPayloads[template], demoEmailContext);
    const footerHtml = email.html.slice(email.html.lastIndexOf('Wrenfield Roastworks<br>'));
    expect(footerHtml).toContain('12 Old Mill Way<br>Wrenfield, CO 81640<br>United States');
    expect(email.text).toMatch(/--\nWrenfield Roastworks\n12 Old Mill Way\nWrenfield, CO 81640\nUnited States\n/);
  });

  it('escapes every value a person typed, and the shop details too', () => {
    const email = renderEmail(template, hostilePayload(template), hostileContext);
    expect(email.html).not.toContain('<script');
    expect(email.html).not.toContain('<b>');
    expect(email.html).not.toContain('<img');
    expect(email.html).toContain('Wrenfield &#60;b&#62;Roastworks&#60;/b&#62;');
    expect(email.html).toContain('&#60;script&#62;alert(&#34;x&#34;)&#60;/script&#62; &#38; Bobby&#39;s &#34;tables&#34;');
    // Plain text is plain: the value appears as typed, never interpreted.
    expect(email.text).toContain('Wrenfield <b>Roastworks</b>');
  });

  it('uses no image, stylesheet or font from the internet', () => {
    const email = renderEmail(template, demoEmailPayloads[template], demoEmailContext);
    expect(email.html).not.toMatch(/<img|<link|@import|url\(/i);
  });
});

describe('the shipped e-mail and the ready-from date', () => {
  const base = { ...demoEmailPayloads.shipped, readyFrom: '2026-02-16', bestBefore: '2026-03-09' };

  it('says the coffee is ready to brew on arrival when it lands rested', () => {
    const email = renderEmail('shipped', { ...base, expectedArrival: '2026-02-20', readyOnArrival: true }, demoEmailContext);
    expect(email.text).toContain('ready to brew when it arrives');
    expect(email.text).toContain('Friday, February 20, 2026');
    expect(email.text).not.toContain('may arrive before');
  });

  it('says it may arrive before it is ready, and gives the ready-from date, when it lands early', () => {
    // The Mon 9 Feb 2026 espresso shipped straight after the hold: lands Fri 13, ready Mon 16.
    const email = renderEmail('shipped', { ...base, expectedArrival: '2026-02-13', readyOnArrival: false }, demoEmailContext);
    expect(email.text).toContain('may arrive before it is at its best');
    expect(email.text).toContain('Monday, February 16, 2026');
  });
});

describe('payload checks', () => {
  it('refuses a link that is not http(s), so no javascript: URL reaches an href', () => {
    expect(() => renderEmail('password-reset', { ...demoEmailPayloads['password-reset'], resetUrl: 'javascript:alert(1)' }, demoEmailContext)).toThrow(
      ZodError,
    );
  });

  it('refuses a payload that misses what the template needs (the seed-style {orderId} alone)', () => {
    expect(emailPayloadSchemas['rest-day'].safeParse({ orderId: 'x' }).success).toBe(false);
  });

  it('takes an instant as a Date or as the ISO string it becomes in the outbox row', () => {
    const asDate = renderEmail('password-reset', { ...demoEmailPayloads['password-reset'], expiresAt: new Date('2026-12-08T17:30:00Z') }, demoEmailContext);
    const asText = renderEmail('password-reset', demoEmailPayloads['password-reset'], demoEmailContext);
    expect(asDate.html).toBe(asText.html);
    expect(asText.text).toContain('December 8, 2026 at 10:30 AM MST');
  });

  it('formats money with the shared money rules and weights with the shared label rules', () => {
    const email = renderEmail('order-confirmed', demoEmailPayloads['order-confirmed'], demoEmailContext);
    expect(email.text).toContain('$42.60');
    expect(email.text).toContain('Net Wt 16 oz (1 lb) 454 g'); // ounces first from 1 lb (15 U.S.C. 1453(a)(3)(A))
  });
});
