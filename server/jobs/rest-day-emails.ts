import { createRestDayRepo } from '../modules/packing/rest-day.repo';
import { queueRestDayEmails } from '../modules/packing/rest-day.service';
import { defineJob } from './registry';

/**
 * Every ten minutes: queue the rest-day e-mail of each shipped roasted order whose ready-from
 * morning (shop time) has come. Reads the injected clock, so the test clock moves it; running twice
 * queues nothing twice (the outbox's dedupe key).
 */
export const restDayEmailsJob = defineJob<Record<string, never>>({
  name: 'rest-day-emails',
  schedule: { cron: '*/10 * * * *' },
  retryLimit: 3,
  async run(_data, { db, clock, logger }) {
    const queued = await queueRestDayEmails(createRestDayRepo(db), clock.now());
    if (queued > 0) logger.info({ queued }, 'rest-day e-mails queued');
  },
});
