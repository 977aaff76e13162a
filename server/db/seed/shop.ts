// The invented shop's settings and its Roast Calendar overrides (an invented holiday and maintenance day).
import { findCarrier, trackingUrl } from '../../../shared/domain/carriers';
import { defaultLossModel } from '../../../shared/domain/roast-loss';
import { defaultShopSettings } from '../../../shared/schemas/settings';
import type * as schema from '../schema/index';
import { demoCalendar, type DemoCalendar } from './demo-dates';
import { demoShop } from './demo-people';
import type { Insert, SeedClock } from './scenario-values';

/** The carriers the demo shop ships with (invented names; the demo orders use them). */
export const demoCarriers = [
  { name: 'Kestrel Post', trackingUrlTemplate: 'https://track.example.com/parcel/{tracking}' },
  { name: 'Larkspur Freight', trackingUrlTemplate: 'https://larkspur.example.net/find?number={tracking}' },
];

/** The tracking page of a demo parcel, as the shipped e-mail links it. */
export function demoTrackingUrl(carrierName: string, trackingNumber: string): string | undefined {
  const carrier = findCarrier(demoCarriers, carrierName);
  return carrier && trackingUrl(carrier.trackingUrlTemplate, trackingNumber);
}

/** The shop's settings: the product's default schedule, roaster and loss model. */
export function demoShopSettings(clock: SeedClock) {
  return {
    id: 1,
    shopName: demoShop.shopName,
    timeZone: demoShop.timeZone,
    placeOfBusiness: demoShop.placeOfBusiness,
    roastWeekdays: [2, 4],
    cutoffTime: '12:00',
    cutoffDaysBefore: 1,
    shipWeekdays: [1, 2, 3, 4, 5],
    transitDays: 3,
    degasHoldDays: 1,
    restDaysFilter: 2,
    restDaysEspresso: 7,
    // Darker roasts rest less (Smrke et al. 2017; the days from memory).
    restAdjustDays: defaultShopSettings.restAdjustDays,
    shipPolicy: 'ready_on_arrival',
    holdOverWeekend: true,
    bestBeforeDays: 28,
    overagePct: 3,
    roasterCapacityGrams: 6000,
    minLoadPct: 50,
    maxLoadPct: 80,
    dailyCapacityGrams: 48_000,
    lossModel: defaultLossModel,
    // Invented carriers with reserved example domains: the shipped e-mails link to no real site.
    carriers: demoCarriers,
    updatedAt: clock.daysAgo(30),
  } satisfies Insert<typeof schema.shopSettings>;
}

export type DemoShopSettings = ReturnType<typeof demoShopSettings>;

/** The overrides, and the calendar that knows them: roast days closed, ship days closed. */
export function demoRoastDays(clock: SeedClock, settings: DemoShopSettings): { roastDays: Insert<typeof schema.roastDays>[]; cal: DemoCalendar } {
  const { daysAgo } = clock;
  const ahead = demoCalendar(clock.now, settings).roastWeekdaysFromToday(12);
  const [founderDay, maintenanceDay, shortDay] = [ahead[3] as string, ahead[11] as string, ahead[1] as string];
  const roastDays: Insert<typeof schema.roastDays>[] = [
    {
      date: founderDay,
      open: false,
      shipOpen: false,
      note: "Wrenfield Founders' Day (invented town holiday): roastery and shipping closed",
      createdAt: daysAgo(40),
      updatedAt: daysAgo(40),
    },
    { date: maintenanceDay, open: false, note: 'Roaster maintenance: afterburner service (invented)', createdAt: daysAgo(12), updatedAt: daysAgo(12) },
    {
      date: shortDay,
      open: true,
      capacityGrams: 30_000,
      note: 'Short day: cupping training in the afternoon (invented)',
      createdAt: daysAgo(9),
      updatedAt: daysAgo(9),
    },
  ];
  // The maintenance day closes roasting only: parcels still go out.
  const cal = demoCalendar(clock.now, settings, new Set([founderDay, maintenanceDay]), new Set([founderDay]));
  return { roastDays, cal };
}
