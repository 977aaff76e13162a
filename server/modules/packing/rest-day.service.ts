import { addDays, instantAt, localDateOf, localTimeOf } from '@shared/domain/shop-time';
import { restDayDedupeKey, type RestDayRepo } from './rest-day.repo';

/** The rest-day e-mail goes out from this shop-local time on the ready-from date. */
export const REST_DAY_MORNING = '08:00';
/**
 * Days after the ready-from date the e-mail may still go out (workers down that morning). Later
 * than that "today is the rest day" would be wrong, so it is left unsent.
 */
export const REST_DAY_LATE_DAYS = 2;

/**
 * Queues the rest-day e-mail for every shipped roasted order whose ready-from morning has come, by
 * the given instant in the shop's time zone. Each order gets it once (dedupe key
 * `rest-day:<orderId>`); a cancelled or refunded order never does, nor one that shipped after its
 * ready-from morning (its shipped e-mail already said so). Returns how many were queued.
 */
export async function queueRestDayEmails(repo: RestDayRepo, now: Date): Promise<number> {
  const timeZone = await repo.shopTimeZone();
  const today = localDateOf(now, timeZone);
  const latest = localTimeOf(now, timeZone) >= REST_DAY_MORNING ? today : addDays(today, -1);
  const earliest = addDays(today, -REST_DAY_LATE_DAYS);
  if (latest < earliest) return 0;
  let queued = 0;
  for (const order of await repo.ordersDue(earliest, latest)) {
    const readyFrom = order.readyFrom!;
    if (order.shippedAt && order.shippedAt > instantAt(readyFrom, REST_DAY_MORNING, timeZone)) continue;
    const [first] = order.lines;
    const sent = await repo.queueIfStillShipped(order.id, {
      template: 'rest-day',
      to: order.customerEmail,
      dedupeKey: restDayDedupeKey(order.id),
      payload: {
        name: order.customerName,
        orderId: order.id,
        readyFrom,
        brewMethod: first?.brewMethod ?? 'filter',
        ...(first ? { coffee: first.coffee } : {}),
        ...(order.bestBefore ? { bestBefore: order.bestBefore } : {}),
      },
    });
    if (sent) queued += 1;
  }
  return queued;
}
