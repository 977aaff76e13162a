import { eq, like } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import { defaultShopSettings } from '@shared/schemas/settings';
import { emailOutbox, subscriptions } from '../../server/db/schema/index';
import { loadConfig } from '../../server/config';
import { renewalRemindersJob } from '../../server/jobs/renewal-reminders';
import { jobs } from '../../server/jobs/workers';
import { createAdjustableClock } from '../../server/lib/clock';
import { createLogger } from '../../server/lib/logger';
import { saveShopSettings } from '../../server/modules/settings/settings.repo';
import { getTestDb } from '../setup/test-db';
import { useShopSettings } from './subscriber-support';
import { createLotForSale, createTestUser, inventSubscription } from '../factories/index';

// The default shop is in New York and reminds 3 days before a charge (renewalReminderDays).
useShopSettings({ ...defaultShopSettings, renewalReminderDays: 3 });

const config = loadConfig({ NODE_ENV: 'test', LOG_LEVEL: 'silent', STATIC_DIR: 'dist' });
const clock = createAdjustableClock();
const context = { db: getTestDb(), clock, logger: createLogger(config), config };

/** One scheduled run of the job, at the test clock's "now". */
async function runAt(instant: string) {
  clock.set(new Date(instant));
  await renewalRemindersJob.run({}, context, { id: 'test-run', retryCount: 0 });
}

async function remindersOf(subscriptionId: string) {
  return getTestDb()
    .select({ dedupeKey: emailOutbox.dedupeKey, toAddress: emailOutbox.toAddress, subject: emailOutbox.subject, payload: emailOutbox.payload })
    .from(emailOutbox)
    .where(like(emailOutbox.dedupeKey, `renewal-reminder:${subscriptionId}:%`))
    .orderBy(emailOutbox.createdAt);
}

describe('the renewal-reminders job', () => {
  it('runs on a schedule among the workers’ jobs', () => {
    expect(jobs).toContain(renewalRemindersJob);
    expect(renewalRemindersJob.schedule?.cron).toBe('*/15 * * * *');
  });

  it('queues exactly one reminder per paid period, once the charge is within the reminder days', async () => {
    const customer = await createTestUser('customer');
    const lot = await createLotForSale(10_000);
    // Next charge Thu 5 Jun 2031, 11:00 EDT (15:00Z).
    const subscriptionId = await inventSubscription(customer, { lotId: lot.id, priceCents: 4135, currentPeriodEnd: new Date('2031-06-05T15:00:00Z') });

    // Sun 1 Jun 23:59 EDT: the charge is 4 shop days away, outside the 3-day window.
    await runAt('2031-06-02T03:59:00Z');
    expect(await remindersOf(subscriptionId)).toEqual([]);
    // Mon 2 Jun 00:00 EDT: 3 days away. Runs every 15 minutes after it add nothing.
    await runAt('2031-06-02T04:00:00Z');
    await runAt('2031-06-02T04:15:00Z');
    await runAt('2031-06-04T20:00:00Z');
    expect(await remindersOf(subscriptionId)).toEqual([
      {
        dedupeKey: `renewal-reminder:${subscriptionId}:2031-06-05`,
        toAddress: customer.email,
        subject: 'Your next delivery renews on Thursday, June 5, 2031',
        payload: { name: customer.name, subscriptionId, coffee: lot.name, renewsOn: '2031-06-05', amountCents: 4135, currency: 'usd' },
      },
    ]);

    // The charge went through; the next one is two weeks on, Thu 19 Jun.
    await getTestDb()
      .update(subscriptions)
      .set({ currentPeriodEnd: new Date('2031-06-19T15:00:00Z') })
      .where(eq(subscriptions.id, subscriptionId));
    await runAt('2031-06-10T14:00:00Z');
    expect(await remindersOf(subscriptionId)).toHaveLength(1);
    await runAt('2031-06-16T14:00:00Z');
    await runAt('2031-06-17T14:00:00Z');
    const reminders = await remindersOf(subscriptionId);
    expect(reminders.map((reminder) => reminder.dedupeKey)).toEqual([
      `renewal-reminder:${subscriptionId}:2031-06-05`,
      `renewal-reminder:${subscriptionId}:2031-06-19`,
    ]);
  });

  it('never reminds a paused, cancelled or ending subscription, nor one whose charge has passed', async () => {
    const customer = await createTestUser('customer');
    const charge = new Date('2031-07-03T15:00:00Z');
    const paused = await inventSubscription(customer, { status: 'paused', pausedUntil: '2031-08-01', currentPeriodEnd: charge });
    const pausedOverCharge = await inventSubscription(customer, { pausedUntil: '2031-07-10', currentPeriodEnd: charge });
    const cancelled = await inventSubscription(customer, { status: 'cancelled', cancelledAt: new Date('2031-06-20T12:00:00Z'), currentPeriodEnd: charge });
    const ending = await inventSubscription(customer, { currentPeriodEnd: charge });
    await getTestDb().update(subscriptions).set({ cancelAtPeriodEnd: true }).where(eq(subscriptions.id, ending));
    const passed = await inventSubscription(customer, { currentPeriodEnd: new Date('2031-07-01T13:00:00Z') });
    const due = await inventSubscription(customer, { pausedUntil: '2031-06-20', currentPeriodEnd: charge });

    await runAt('2031-07-01T14:00:00Z');
    for (const subscriptionId of [paused, pausedOverCharge, cancelled, ending, passed]) expect(await remindersOf(subscriptionId)).toEqual([]);
    // A pause that ended before the charge day does not stop the reminder.
    expect(await remindersOf(due)).toHaveLength(1);
  });

  it('sends none while the owner has reminders off (0 days)', async () => {
    const customer = await createTestUser('customer');
    const subscriptionId = await inventSubscription(customer, { currentPeriodEnd: new Date('2031-08-06T15:00:00Z') });
    await saveShopSettings(getTestDb(), { ...defaultShopSettings, renewalReminderDays: 0 });
    try {
      await runAt('2031-08-05T14:00:00Z');
      await runAt('2031-08-06T14:00:00Z');
      expect(await remindersOf(subscriptionId)).toEqual([]);
    } finally {
      await saveShopSettings(getTestDb(), { ...defaultShopSettings, renewalReminderDays: 3 });
    }
    await runAt('2031-08-06T14:00:00Z');
    expect(await remindersOf(subscriptionId)).toHaveLength(1);
  });
});
