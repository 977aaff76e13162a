import { addDays, instantAt, localDateOf } from '@shared/domain/shop-time';
import { roastersRotationName } from '@shared/domain/vocabulary';
import type { Logger } from '../lib/logger';
import { createRenewalRemindersRepo, type RenewalRemindersRepo } from '../modules/subscribers/renewal-reminders.repo';
import { defineJob } from './registry';

/**
 * Queues the renewal-reminder e-mail for every active subscription charged again within the
 * owner's `renewalReminderDays` (shop-local days, today counting as 0; 0 sends none). One per
 * subscription and period: the dedupe key carries the charge's day, so later runs add nothing
 * until the next period. A subscription paused over its charge day, cancelled or ending with its
 * period gets none. Returns how many reminders were new or already queued.
 */
export async function queueRenewalReminders(repo: RenewalRemindersRepo, now: Date, logger: Logger): Promise<number> {
  const settings = await repo.shopSettings();
  if (settings.renewalReminderDays === 0) return 0;
  const lastDay = addDays(localDateOf(now, settings.timeZone), settings.renewalReminderDays);
  const renewing = await repo.renewingBetween(now, instantAt(addDays(lastDay, 1), '00:00', settings.timeZone));
  let queued = 0;
  for (const subscription of renewing) {
    const renewsOn = localDateOf(subscription.currentPeriodEnd!, settings.timeZone);
    if (subscription.pausedUntil !== null && subscription.pausedUntil > renewsOn) continue;
    try {
      await repo.queueReminder({
        template: 'renewal-reminder',
        to: subscription.email,
        payload: {
          name: subscription.name,
          subscriptionId: subscription.id,
          coffee: subscription.lotName ?? roastersRotationName,
          renewsOn,
          amountCents: subscription.priceCents,
          currency: subscription.currency,
        },
        dedupeKey: `renewal-reminder:${subscription.id}:${renewsOn}`,
      });
      queued += 1;
    } catch (error) {
      // One unusable row (an address the outbox refuses) must not hold back everyone else's reminder.
      logger.warn({ err: error, subscriptionId: subscription.id }, 'renewal reminder not queued');
    }
  }
  return queued;
}

/** Every 15 minutes, so a reminder goes out soon after its day begins whatever the shop's time zone. */
export const renewalRemindersJob = defineJob<Record<string, never>>({
  name: 'renewal-reminders',
  schedule: { cron: '*/15 * * * *' },
  retryLimit: 3,
  async run(_data, { db, clock, logger }) {
    const queued = await queueRenewalReminders(createRenewalRemindersRepo(db), clock.now(), logger);
    logger.debug({ queued }, 'renewal reminders checked');
  },
});
