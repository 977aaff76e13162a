import { describe, expect, it } from 'vitest';
import { demoEmailContext, demoEmailPayloads } from '../../emails/demo';
import { emailPayloadSchemas, renderEmail, type EmailPayloads } from '../../emails/index';

const base = demoEmailPayloads['subscription-changed'];

function render(overrides: Partial<EmailPayloads['subscription-changed']>) {
  return renderEmail('subscription-changed', { ...base, ...overrides }, demoEmailContext);
}

describe('the subscription-changed e-mail', () => {
  it('lists what changed and the next delivery in both parts', () => {
    const email = render({ change: 'changed' });
    expect(email.subject).toBe('Your Roasted to Order subscription is updated');
    expect(email.text).toContain('What changed\nRoast level: Medium-dark\nGrind: Whole bean\nDelivery: every 3 weeks');
    expect(email.text).toContain('Roast day: Wednesday, December 16, 2026');
    expect(email.text).toContain('Ready to brew from: Friday, December 18, 2026');
    expect(email.html).toContain('Roast level: Medium-dark');
    expect(email.text).toContain('Manage your subscription:\nhttp://127.0.0.1:3000/account/deliveries');
  });

  it('names the next roast day when a delivery is skipped', () => {
    expect(render({ change: 'skipped', summary: [] }).subject).toBe('Delivery skipped: your next one roasts on Wednesday, December 16, 2026');
    expect(render({ change: 'skipped', summary: [], nextDelivery: undefined }).subject).toBe('Your delivery is skipped');
  });

  it('says until when a pause lasts', () => {
    const email = render({ change: 'paused', pausedUntil: '2027-01-10', nextDelivery: undefined });
    expect(email.subject).toBe('Your subscription is paused until Sunday, January 10, 2027');
    expect(email.text).toContain('paused until Sunday, January 10, 2027');
    expect(render({ change: 'paused', nextDelivery: undefined }).subject).toBe('Your subscription is paused');
  });

  it('welcomes a resumed subscriber back with the next delivery', () => {
    const email = render({ change: 'resumed', summary: [] });
    expect(email.subject).toBe('Your subscription is back on');
    expect(email.text).toContain('Roast day: Wednesday, December 16, 2026');
  });

  it('gives the last day of a cancelled subscription and no next delivery', () => {
    const email = render({ change: 'cancelled', summary: [], endsOn: '2026-12-29' });
    expect(email.subject).toBe('Your subscription ends on Tuesday, December 29, 2026');
    expect(email.text).toContain('we will not charge you again');
    expect(email.text).not.toContain('Roast day:');
    expect(render({ change: 'cancelled', summary: [] }).subject).toBe('Your subscription is cancelled');
  });

  it('refuses a change kind it does not know', () => {
    expect(emailPayloadSchemas['subscription-changed'].safeParse({ ...base, change: 'upgraded' }).success).toBe(false);
  });
});
