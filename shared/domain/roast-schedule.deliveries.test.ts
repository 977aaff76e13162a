// Subscription delivery schedules from the trade engine, each against dates worked out by hand.
//
// The shop throughout is Restday's default (defaultShopSettings): America/New_York; roasts Mon, Wed
// and Fri; order cutoff 12:00 the day before the roast; ships Mon–Fri once a 1-day degassing hold
// is over; 3 business days in transit; rest 2 days for filter and 7 for espresso, medium level +0;
// best-before 28 days after the roast (product defaults). Ship policy "ready on arrival"
// and the weekend hold are on (product defaults): with 3 transit days a parcel shipped Wed, Thu
// or Fri would sit in transit over Sat and Sun (common practice: avoid that), so only Mon and Tue
// ship. No US federal holiday falls in March 2027 (5 U.S.C. 6103).
//
// US daylight saving time follows the Energy Policy Act of 2005 (§110, amending 15 U.S.C. 260a;
// in force since 2007): clocks go forward at 02:00 on the second Sunday of March and back at
// 02:00 on the first Sunday of November. In 2027: 1 March is a Monday, so the Sundays are 7 and
// 14 March and the change is on Sunday 14 March (EST −5 h → EDT −4 h); 1 November is a Monday, so
// the first Sunday is 7 November (EDT → EST). Noon on a cutoff day is 17:00Z under EST, 16:00Z under EDT.
import { describe, expect, it } from 'vitest';
import { defaultShopSettings } from '../schemas/settings';
import { subscriptionDeliveries, type RoastCalendar, type SubscriptionForSchedule } from './roast-schedule';

const shop = defaultShopSettings;

function deliveries(subscription: Partial<SubscriptionForSchedule> & Pick<SubscriptionForSchedule, 'anchorDate' | 'now'>, calendar: RoastCalendar = {}) {
  return subscriptionDeliveries({ brewMethod: 'filter', roastLevel: 'medium', cadenceWeeks: 1, count: 3, ...subscription }, shop, calendar);
}

const roastDates = (list: ReturnType<typeof deliveries>) => list.map((delivery) => delivery.roastDate);

describe('a subscription delivery at its cutoff', () => {
  // Weekly on Wednesdays from Wed 3 Mar 2027. That delivery's cutoff is Tue 2 Mar 12:00 EST = 17:00Z.
  const weekly = { anchorDate: '2027-03-03', cadenceWeeks: 1 } as const;

  it('is open to changes one minute before its cutoff', () => {
    const [first, second] = deliveries({ ...weekly, now: new Date('2027-03-02T16:59:00Z') });
    // Wed 3 Mar: ready Fri 5 Mar (filter, +2 days); best-before Wed 31 Mar (+28). The hold allows
    // Thu 4 Mar, but Thu → Fri 5, Mon 8, Tue 9 crosses Sat 6/Sun 7, and so does Fri 5; Mon 8 →
    // Tue 9, Wed 10, Thu 11 does not (and lands after Fri 5: ready on arrival). Ships Mon 8 Mar.
    expect(first).toEqual({
      nominalDate: '2027-03-03',
      roastDate: '2027-03-03',
      cutoffAt: '2027-03-02T17:00:00.000Z',
      shipDate: '2027-03-08',
      readyFrom: '2027-03-05',
      bestBefore: '2027-03-31',
      expectedArrival: '2027-03-11',
      status: 'scheduled',
      movedByClosure: false,
      locked: false,
    });
    expect(second).toMatchObject({ roastDate: '2027-03-10', locked: false });
  });

  it('is locked one minute after its cutoff, while the following one stays open', () => {
    const [first, second, third] = deliveries({ ...weekly, now: new Date('2027-03-02T17:01:00Z') });
    // Still listed (it roasts tomorrow) with the same dates, but a change now reaches Wed 10 Mar.
    expect(first).toMatchObject({ roastDate: '2027-03-03', shipDate: '2027-03-08', locked: true });
    // Wed 10 Mar: cutoff Tue 9 Mar 12:00, still EST (the change comes on 14 March) = 17:00Z.
    expect(second).toMatchObject({ roastDate: '2027-03-10', cutoffAt: '2027-03-09T17:00:00.000Z', locked: false });
    // Wed 17 Mar: cutoff Tue 16 Mar 12:00 EDT = 16:00Z.
    expect(third).toMatchObject({ roastDate: '2027-03-17', cutoffAt: '2027-03-16T16:00:00.000Z', locked: false });
  });

  it('is locked at the cutoff instant itself', () => {
    expect(deliveries({ ...weekly, now: new Date('2027-03-02T17:00:00Z') })[0]?.locked).toBe(true);
  });
});

describe('a closed roast day', () => {
  it('moves that delivery to the next open roast day and keeps the following one on its weekday', () => {
    // Weekly on Mondays from Mon 1 Mar 2027; the roastery closes Mon 8 Mar. Seen on Sun 28 Feb, 07:00 EST.
    const closed: RoastCalendar = { overrides: { '2027-03-08': { open: false, note: 'Roaster service' } } };
    const list = deliveries({ anchorDate: '2027-03-01', now: new Date('2027-02-28T12:00:00Z') }, closed);
    expect(roastDates(list)).toEqual(['2027-03-01', '2027-03-10', '2027-03-15']);
    // The 8th's delivery: Tue 9 Mar is not a roast weekday, so it roasts Wed 10 Mar; it keeps its
    // place on the grid (nominal 8 Mar). Cutoff Tue 9 Mar 12:00 EST = 17:00Z; ready Fri 12 (+2);
    // best-before Wed 7 Apr (+28). Thu 11 and Fri 12 would sit over Sat 13/Sun 14; ships Mon 15,
    // arrives Tue 16, Wed 17, Thu 18 Mar.
    expect(list[1]).toEqual({
      nominalDate: '2027-03-08',
      roastDate: '2027-03-10',
      cutoffAt: '2027-03-09T17:00:00.000Z',
      shipDate: '2027-03-15',
      readyFrom: '2027-03-12',
      bestBefore: '2027-04-07',
      expectedArrival: '2027-03-18',
      status: 'scheduled',
      movedByClosure: true,
      locked: false,
    });
    // Mon 15 Mar is back on the grid, not a week after the 10th.
    expect(list[2]).toMatchObject({ nominalDate: '2027-03-15', movedByClosure: false });
  });

  it('moves the ship day past a ship-day closure, and not past a roast-only closure', () => {
    // Wed 3 Mar would ship Mon 8 Mar (above); with shipping closed on Mon 8 it ships Tue 9 Mar
    // (→ Wed 10, Thu 11, Fri 12: no weekend). Ready-from is counted from the roast: Fri 5 Mar.
    const now = new Date('2027-03-01T12:00:00Z');
    const shipClosed = deliveries({ anchorDate: '2027-03-03', now, count: 1 }, { overrides: { '2027-03-08': { open: false, shipOpen: false } } });
    expect(shipClosed[0]).toMatchObject({ roastDate: '2027-03-03', shipDate: '2027-03-09', readyFrom: '2027-03-05', expectedArrival: '2027-03-12' });
    // Closing Mon 8 Mar to roasting only leaves it a ship day.
    const roastClosed = deliveries({ anchorDate: '2027-03-03', now, count: 1 }, { overrides: { '2027-03-08': { open: false } } });
    expect(roastClosed[0]).toMatchObject({ shipDate: '2027-03-08' });
  });
});

describe('a skipped delivery', () => {
  it('stays listed as skipped and moves nothing after it', () => {
    // Every 2 weeks on Fridays from Fri 2 Apr 2027; the subscriber skips Fri 16 Apr. Seen Thu 1 Apr 08:00 EDT.
    const list = deliveries({ anchorDate: '2027-04-02', cadenceWeeks: 2, skippedDates: ['2027-04-16'], now: new Date('2027-04-01T12:00:00Z') });
    expect(list.map((delivery) => [delivery.roastDate, delivery.status])).toEqual([
      ['2027-04-02', 'scheduled'],
      ['2027-04-16', 'skipped'],
      // Fri 30 Apr, two weeks after the skipped one: the grid holds.
      ['2027-04-30', 'scheduled'],
    ]);
    // A Friday roast ships the next weekday: Sat 3 Apr is not one, so Mon 5 Apr. Ready Sun 4 Apr
    // (+2; rest runs every day). Best-before Fri 30 Apr (+28). Cutoff Thu 1 Apr 12:00 EDT = 16:00Z.
    expect(list[0]).toMatchObject({ shipDate: '2027-04-05', readyFrom: '2027-04-04', bestBefore: '2027-04-30', cutoffAt: '2027-04-01T16:00:00.000Z' });
    expect(list[2]).toMatchObject({ shipDate: '2027-05-03', readyFrom: '2027-05-02', bestBefore: '2027-05-28' });
  });
});

describe('a pause and a resume', () => {
  // Weekly on Wednesdays from Wed 7 Apr 2027, seen on Mon 5 Apr at 10:00 EDT.
  const weekly = { anchorDate: '2027-04-07', now: new Date('2027-04-05T14:00:00Z') } as const;

  it('lists nothing roasting before the pause ends, then carries on from the grid', () => {
    // Paused until Mon 26 Apr: 7, 14 and 21 Apr fall before it; Wed 28 Apr is the first after.
    expect(roastDates(deliveries({ ...weekly, pausedUntil: '2027-04-26' }))).toEqual(['2027-04-28', '2027-05-05', '2027-05-12']);
    // A pause ending midweek (Thu 22 Apr) brings no extra delivery on that day: the next is still Wed 28 Apr.
    expect(roastDates(deliveries({ ...weekly, pausedUntil: '2027-04-22' }))[0]).toBe('2027-04-28');
    // A pause until Wed 21 Apr ends that morning: the 21st roasts.
    expect(roastDates(deliveries({ ...weekly, pausedUntil: '2027-04-21' }))[0]).toBe('2027-04-21');
  });

  it('after a resume, lists the grid again from today', () => {
    expect(roastDates(deliveries({ ...weekly, pausedUntil: null }))).toEqual(['2027-04-07', '2027-04-14', '2027-04-21']);
    // Resumed on Tue 13 Apr: before noon EDT (16:00Z) Wed 14 Apr can still be changed; after it, it is locked.
    expect(deliveries({ ...weekly, now: new Date('2027-04-13T15:59:00Z') })[0]).toMatchObject({ roastDate: '2027-04-14', locked: false });
    expect(deliveries({ ...weekly, now: new Date('2027-04-13T16:00:00Z') })[0]).toMatchObject({ roastDate: '2027-04-14', locked: true });
  });
});

describe('a cadence change', () => {
  // Every 2 weeks on Mondays from Mon 3 May 2027: 3, 17 and 31 May. Mon 17 May's cutoff is Sun
  // 16 May 12:00 EDT = 16:00Z. The subscriber moves to every 4 weeks. The engine's rule: anchor
  // the new series on the nominal date of the first delivery that is not locked.
  const every2 = { anchorDate: '2027-05-03', cadenceWeeks: 2 } as const;

  function changeTo4Weeks(now: Date) {
    const current = deliveries({ ...every2, now });
    const firstOpen = current.find((delivery) => !delivery.locked)!;
    const locked = current.filter((delivery) => delivery.locked).map((delivery) => delivery.roastDate);
    return [...locked, ...roastDates(deliveries({ anchorDate: firstOpen.nominalDate, cadenceWeeks: 4, now }))];
  }

  it('before the cutoff, starts the new cadence with the next delivery', () => {
    // Sun 16 May 11:59 EDT: Mon 17 May is open, so the new series is 17 May, 14 Jun, 12 Jul.
    expect(changeTo4Weeks(new Date('2027-05-16T15:59:00Z'))).toEqual(['2027-05-17', '2027-06-14', '2027-07-12']);
  });

  it('after the cutoff, keeps the locked delivery and starts the new cadence with the one after', () => {
    // Sun 16 May 12:01 EDT: Mon 17 May is locked and roasts as it was; the new series is 31 May,
    // 28 Jun, 26 Jul (four weeks apart).
    expect(changeTo4Weeks(new Date('2027-05-16T16:01:00Z'))).toEqual(['2027-05-17', '2027-05-31', '2027-06-28', '2027-07-26']);
  });
});

describe('a US daylight-saving change', () => {
  it('keeps weekly roast days on their weekday and moves the cutoff instant with the clocks in March', () => {
    // Weekly on Mondays from Mon 8 Mar 2027, seen on Sat 6 Mar 10:00 EST. Each cutoff is noon on the Sunday before.
    const list = deliveries({ anchorDate: '2027-03-08', now: new Date('2027-03-06T15:00:00Z') });
    expect(list.map((delivery) => [delivery.roastDate, delivery.cutoffAt, delivery.readyFrom])).toEqual([
      // Sun 7 Mar noon, EST = 17:00Z.
      ['2027-03-08', '2027-03-07T17:00:00.000Z', '2027-03-10'],
      // Sun 14 Mar noon: clocks went forward at 02:00 that morning, EDT = 16:00Z. The week was
      // 167 hours long, yet the roast is still Monday, 7 calendar days on.
      ['2027-03-15', '2027-03-14T16:00:00.000Z', '2027-03-17'],
      ['2027-03-22', '2027-03-21T16:00:00.000Z', '2027-03-24'],
    ]);
    // Locked at 12:00 EDT on the day of the change, not an hour later as a fixed EST offset would say.
    expect(deliveries({ anchorDate: '2027-03-08', now: new Date('2027-03-14T15:59:00Z') })[0]).toMatchObject({ roastDate: '2027-03-15', locked: false });
    expect(deliveries({ anchorDate: '2027-03-08', now: new Date('2027-03-14T16:00:00Z') })[0]).toMatchObject({ roastDate: '2027-03-15', locked: true });
  });

  it('keeps weekly roast days on their weekday and moves the cutoff instant with the clocks in November', () => {
    // Weekly on Mondays from Mon 1 Nov 2027, seen on Sat 30 Oct 10:00 EDT.
    const list = deliveries({ anchorDate: '2027-11-01', now: new Date('2027-10-30T14:00:00Z'), brewMethod: 'espresso' });
    expect(list.map((delivery) => [delivery.roastDate, delivery.cutoffAt, delivery.readyFrom])).toEqual([
      // Sun 31 Oct noon, EDT = 16:00Z. Espresso rests 7 days: ready Mon 8 Nov.
      ['2027-11-01', '2027-10-31T16:00:00.000Z', '2027-11-08'],
      // Sun 7 Nov noon: clocks went back at 02:00 that morning, EST = 17:00Z (a 169-hour week).
      ['2027-11-08', '2027-11-07T17:00:00.000Z', '2027-11-15'],
      ['2027-11-15', '2027-11-14T17:00:00.000Z', '2027-11-22'],
    ]);
    expect(deliveries({ anchorDate: '2027-11-01', now: new Date('2027-11-07T16:59:00Z') })[0]).toMatchObject({ roastDate: '2027-11-08', locked: false });
    expect(deliveries({ anchorDate: '2027-11-01', now: new Date('2027-11-07T17:00:00Z') })[0]).toMatchObject({ roastDate: '2027-11-08', locked: true });
  });
});
