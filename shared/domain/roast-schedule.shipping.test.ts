// Ship days, carrier holidays, the weekend hold and the ship policy, against dates worked by hand.
//
// The shop is Restday's default (defaultShopSettings): America/New_York; ships Mon–Fri after a
// 1-day degassing hold; 3 transit days; rest 2 days for filter and 7 for espresso (medium +0);
// ship policy "ready on arrival" and the weekend hold on (the product's rule). Holidays: 5 U.S.C. 6103 as
// observed (OPM's federal holidays page, from memory): Washington's Birthday Mon 16 Feb 2026,
// Thanksgiving Thu 26 Nov 2026, Christmas Fri 25 Dec 2026, New Year's Day Fri 1 Jan 2027.
// Transit counts Mon–Fri that are not holidays. "Crosses a weekend": a Saturday or Sunday falls
// after the ship date and before the expected arrival (common practice: no parcel sits over a weekend).
import { describe, expect, it } from 'vitest';
import { defaultShopSettings } from '../schemas/settings';
import { arrivalDate, datesForLines, datesForRoastDate, greenOrderDates, roastCalendarDays, type ScheduleSettings } from './roast-schedule';

const shop: ScheduleSettings = defaultShopSettings;
const straight: ScheduleSettings = { ...shop, shipPolicy: 'after_degassing', holdOverWeekend: false };
const weekendOnly: ScheduleSettings = { ...shop, shipPolicy: 'after_degassing', holdOverWeekend: true };
const readyOnly: ScheduleSettings = { ...shop, shipPolicy: 'ready_on_arrival', holdOverWeekend: false };
const filter = { brewMethod: 'filter', roastLevel: 'medium' } as const;
const espresso = { brewMethod: 'espresso', roastLevel: 'medium' } as const;

const shipAndArrival = (dates: { shipDate: string; expectedArrival: string }) => [dates.shipDate, dates.expectedArrival];

describe('Christmas 2026: a roast on Wed 23 Dec with 3 transit days', () => {
  it('never ships on Christmas Day and does not count it in transit', () => {
    // Straight after the hold: ships Thu 24 Dec; transit skips Fri 25 (holiday) and the weekend:
    // Mon 28, Tue 29, Wed 30 → arrives Wed 30 Dec (without the holiday it would be Tue 29).
    expect(shipAndArrival(datesForRoastDate('2026-12-23', filter, straight))).toEqual(['2026-12-24', '2026-12-30']);
    expect(arrivalDate('2026-12-24', 3)).toBe('2026-12-30');
  });

  it('holds it to Mon 28 Dec with the weekend hold on, for filter and espresso', () => {
    // Filter ready Fri 25; espresso ready Wed 30 (23 + 7). Thu 24 → Wed 30 would sit over 26–27 Dec;
    // Fri 25 is a holiday; Mon 28 → Tue 29, Wed 30, Thu 31 Dec: no weekend, and lands on or after
    // both ready-from dates.
    expect(shipAndArrival(datesForRoastDate('2026-12-23', filter, shop))).toEqual(['2026-12-28', '2026-12-31']);
    expect(datesForRoastDate('2026-12-23', espresso, shop)).toMatchObject({ shipDate: '2026-12-28', readyFrom: '2026-12-30', expectedArrival: '2026-12-31' });
  });

  it('ships green coffee paid on Christmas morning on Mon 28 Dec', () => {
    // Fri 25 Dec 2026, 11:00 EST = 16:00Z, before the 12:00 cutoff time, but no parcel ships on the
    // holiday → Mon 28; arrives Tue 29, Wed 30, Thu 31 Dec.
    expect(greenOrderDates(new Date('2026-12-25T16:00:00Z'), shop)).toEqual({ shipDate: '2026-12-28', expectedArrival: '2026-12-31' });
  });

  it('ships on a holiday the owner opens for shipping', () => {
    // The owner's carrier runs on Christmas Day: shipping opened on Fri 25 Dec. Transit still skips
    // the holiday: Mon 28, Tue 29, Wed 30.
    const opened = { overrides: { '2026-12-25': { open: false, shipOpen: true } } };
    expect(greenOrderDates(new Date('2026-12-25T16:00:00Z'), shop, opened)).toEqual({ shipDate: '2026-12-25', expectedArrival: '2026-12-30' });
  });

  it('shows the holiday on the Roast Calendar, closed to shipping but not to roasting', () => {
    const days = roastCalendarDays('2026-12-24', '2026-12-25', shop);
    expect(days.map((day) => [day.date, day.open, day.shipOpen, day.holiday])).toEqual([
      ['2026-12-24', false, true, null],
      // Fri is a roast weekday: a holiday closes the carriers, not the roastery.
      ['2026-12-25', true, false, 'Christmas Day'],
    ]);
  });
});

describe("New Year 2027: Fri 1 Jan is New Year's Day", () => {
  it('ships a roast of Wed 30 Dec 2026 on Mon 4 Jan, or Thu 31 Dec straight after the hold', () => {
    // Straight: Thu 31 Dec → Fri 1 (holiday), Mon 4, Tue 5, Wed 6 Jan.
    expect(shipAndArrival(datesForRoastDate('2026-12-30', filter, straight))).toEqual(['2026-12-31', '2027-01-06']);
    // Weekend hold: Thu 31 would sit over 2–3 Jan; Fri 1 is a holiday; Mon 4 → Tue 5, Wed 6, Thu 7.
    expect(shipAndArrival(datesForRoastDate('2026-12-30', filter, shop))).toEqual(['2027-01-04', '2027-01-07']);
  });

  it('ships green coffee paid after the cutoff time on Thu 31 Dec on Mon 4 Jan', () => {
    // Thu 31 Dec 2026, 13:00 EST = 18:00Z: after the 12:00 cutoff time → Fri 1 Jan, a holiday → Mon 4.
    expect(greenOrderDates(new Date('2026-12-31T18:00:00Z'), shop)).toEqual({ shipDate: '2027-01-04', expectedArrival: '2027-01-07' });
  });
});

describe('Thanksgiving week 2026: Thu 26 Nov', () => {
  it('holds a Mon 23 Nov roast to Mon 30 Nov with the weekend hold on', () => {
    // Filter ready Wed 25. Tue 24 → Wed 25, (Thu 26 holiday), Fri 27, Mon 30: over the weekend.
    // Wed 25 → Fri 27, Mon 30, Tue 1 Dec and Fri 27 → Mon 30, Tue 1, Wed 2: over the weekend; Thu 26
    // is a holiday. Mon 30 → Tue 1, Wed 2, Thu 3 Dec.
    expect(shipAndArrival(datesForRoastDate('2026-11-23', filter, shop))).toEqual(['2026-11-30', '2026-12-03']);
    expect(shipAndArrival(datesForRoastDate('2026-11-23', filter, weekendOnly))).toEqual(['2026-11-30', '2026-12-03']);
    // Weekend hold off: Tue 24, arriving Mon 30 (Wed 25, Fri 27, Mon 30).
    expect(shipAndArrival(datesForRoastDate('2026-11-23', filter, readyOnly))).toEqual(['2026-11-24', '2026-11-30']);
  });

  it('does not count a midweek holiday as a weekend', () => {
    // Two transit days: Tue 24 → Wed 25, (Thu 26 holiday), Fri 27. No Saturday or Sunday in between.
    expect(shipAndArrival(datesForRoastDate('2026-11-23', filter, { ...shop, transitDays: 2 }))).toEqual(['2026-11-24', '2026-11-27']);
  });
});

describe('the weekend hold', () => {
  it('on, holds a Wed roast to Mon; off, ships it Thu', () => {
    // Wed 4 Mar 2026 (no holiday near): Thu 5 → Fri 6, Mon 9, Tue 10 sits over 7–8 Mar;
    // Fri 6 too; Mon 9 → Tue 10, Wed 11, Thu 12.
    expect(shipAndArrival(datesForRoastDate('2026-03-04', filter, weekendOnly))).toEqual(['2026-03-09', '2026-03-12']);
    expect(shipAndArrival(datesForRoastDate('2026-03-04', filter, straight))).toEqual(['2026-03-05', '2026-03-10']);
  });

  it('gives way when no ship day avoids a weekend (five transit days always cross one)', () => {
    // Thu 5 Mar 2026 + 5 transit days: Fri 6, Mon 9, Tue 10, Wed 11, Thu 12. Every ship day's
    // transit holds a Saturday and Sunday, so it ships on the first day the other rules allow.
    expect(shipAndArrival(datesForRoastDate('2026-03-04', filter, { ...shop, transitDays: 5 }))).toEqual(['2026-03-05', '2026-03-12']);
  });
});

describe('ready on arrival: the Mon 9 Feb 2026 example', () => {
  it('espresso: after the degassing hold it lands Fri 13, three days before it is ready', () => {
    // Roast Mon 9 Feb; ready Mon 16 Feb (+7). Hold → Tue 10 → Wed 11, Thu 12, Fri 13. The customer
    // is told the ready-from date. With the weekend hold too: Tue 10's transit has no weekend.
    expect(datesForRoastDate('2026-02-09', espresso, straight)).toMatchObject({
      shipDate: '2026-02-10',
      readyFrom: '2026-02-16',
      expectedArrival: '2026-02-13',
    });
    expect(shipAndArrival(datesForRoastDate('2026-02-09', espresso, weekendOnly))).toEqual(['2026-02-10', '2026-02-13']);
  });

  it('espresso: ready on arrival holds it until it lands ready', () => {
    // Weekend hold off: Tue 10 lands Fri 13 < Mon 16; Wed 11 → Thu 12, Fri 13, (Mon 16 is
    // Washington's Birthday) Tue 17 ≥ Mon 16: ships Wed 11.
    expect(shipAndArrival(datesForRoastDate('2026-02-09', espresso, readyOnly))).toEqual(['2026-02-11', '2026-02-17']);
    // Both on (the defaults): Wed 11, Thu 12 and Fri 13 sit over 14–15 Feb; Mon 16 is a holiday;
    // Tue 17 → Wed 18, Thu 19, Fri 20.
    expect(shipAndArrival(datesForRoastDate('2026-02-09', espresso, shop))).toEqual(['2026-02-17', '2026-02-20']);
  });

  it('filter: ready Wed 11, so it ships Tue 10 under either policy', () => {
    // Tue 10 → Fri 13 ≥ Wed 11, and no weekend in transit.
    for (const settings of [straight, readyOnly, weekendOnly, shop]) {
      expect(datesForRoastDate('2026-02-09', filter, settings)).toMatchObject({
        shipDate: '2026-02-10',
        readyFrom: '2026-02-11',
        expectedArrival: '2026-02-13',
      });
    }
  });

  it('a parcel of espresso and filter bags ships when its espresso will be ready', () => {
    expect(datesForLines('2026-02-09', [filter, espresso], readyOnly)).toMatchObject({ shipDate: '2026-02-11', readyFrom: '2026-02-16' });
  });
});

describe('rest by roast level', () => {
  it('rests light a day longer and medium-dark, dark and French a day shorter by default', () => {
    // Defaults light +1, medium 0, medium-dark −1, dark −1, French −1 (darker roasts
    // degas faster, Smrke et al. 2017; the days from memory). Espresso rests 7 days from Mon 9 Feb 2026.
    const readyFrom = (roastLevel: 'light' | 'medium' | 'medium-dark' | 'dark' | 'french') =>
      datesForRoastDate('2026-02-09', { brewMethod: 'espresso', roastLevel }, shop).readyFrom;
    expect(readyFrom('light')).toBe('2026-02-17');
    expect(readyFrom('medium')).toBe('2026-02-16');
    expect(readyFrom('medium-dark')).toBe('2026-02-15');
    expect(readyFrom('dark')).toBe('2026-02-15');
    expect(readyFrom('french')).toBe('2026-02-15');
  });
});
