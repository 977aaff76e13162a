import { z } from 'zod';
import { HARD_FLOOR_LOAD_PCT } from '../domain/batch-planner';
import { carrierNamesAreUnique, isTrackingUrlTemplate, TRACKING_PLACEHOLDER } from '../domain/carriers';
import { hasAtMostDecimals } from '../domain/integer-math';
import { shopCurrencies, type CurrencyCode } from '../domain/money';
import { DEFAULT_LOSS_MIN_BATCHES, defaultLossModel } from '../domain/roast-loss';
import { isClockTime, isValidTimeZone } from '../domain/shop-time';
import { postalAddressInputSchema } from './address';
import { roastedBagSizes, roastLevels, shipPolicies, weekdays } from '../domain/vocabulary';

/**
 * The owner's shop settings: body of `PUT /api/roastery/settings` and reply of its GET.
 * Fields added after the first version of that body (currency, restAdjustDays, dayCapacityGrams, lossModelMinBatches,
 * roastedBagPriceCents, subscriptionDiscountPct, renewalReminderDays, shipping, shipPolicy,
 * holdOverWeekend, carriers) default when left out; placeOfBusiness, added with the bag labels that print it, must be sent.
 */

const percent = (max: number) =>
  z
    .number()
    .min(0)
    .max(max)
    .refine((value) => hasAtMostDecimals(value, 2), 'Use at most two decimals.');

const wholeDays = (max: number) => z.number().int().min(0).max(max);

const weekdayList = z
  .array(z.enum(weekdays))
  .min(1, 'Choose at least one day.')
  .refine((days) => new Set(days).size === days.length, 'Each day once.');

const lossRangeSchema = z
  .object({ minPct: percent(49.99), maxPct: percent(49.99), defaultPct: percent(49.99) })
  .refine((range) => range.minPct <= range.defaultPct && range.defaultPct <= range.maxPct, {
    message: 'The default must lie between the minimum and the maximum.',
    path: ['defaultPct'],
  });

const lossModelSchema = z.object(
  Object.fromEntries(roastLevels.map((level) => [level, lossRangeSchema])) as Record<(typeof roastLevels)[number], typeof lossRangeSchema>,
);

const roasterSchema = z
  .object({
    capacityGrams: z.number().int().min(100).max(500_000),
    minLoadPct: percent(100).refine((pct) => pct >= HARD_FLOOR_LOAD_PCT, {
      message: `At least ${HARD_FLOOR_LOAD_PCT} %: smaller batches are hard to control.`,
    }),
    maxLoadPct: percent(100).refine((pct) => pct >= HARD_FLOOR_LOAD_PCT, {
      message: `At least ${HARD_FLOOR_LOAD_PCT} %.`,
    }),
  })
  .refine((roaster) => roaster.minLoadPct <= roaster.maxLoadPct, {
    message: 'The preferred minimum load must not exceed the maximum.',
    path: ['minLoadPct'],
  });

const shippingSchema = z
  .object({
    bands: z
      .array(z.object({ maxGrams: z.number().int().positive(), cents: z.number().int().min(0) }))
      .min(1, 'Add at least one weight band.')
      .refine(
        (bands) => bands.every((band, index) => index === 0 || band.maxGrams > (bands[index - 1]?.maxGrams ?? 0)),
        'List the bands from lightest to heaviest, each heavier than the last.',
      ),
    bagTareGrams: z.number().int().min(0).max(2_000),
    boxTareGrams: z.number().int().min(0).max(5_000),
  })
  .refine((shipping) => (shipping.bands.at(-1)?.maxGrams ?? 0) > shipping.boxTareGrams, {
    message: 'The heaviest band must weigh more than the empty box.',
    path: ['bands'],
  });

/** A carrier the shop ships with: the name staff give on the Pack List and its tracking page. */
export const carrierSchema = z.object({
  name: z.string().trim().min(1, 'Name the carrier.').max(60, 'Keep the carrier to 60 characters.'),
  trackingUrlTemplate: z
    .string()
    .trim()
    .max(500, 'Keep the address to 500 characters.')
    .refine(isTrackingUrlTemplate, `Use an https address with ${TRACKING_PLACEHOLDER} where the tracking number goes.`),
});

const carrierListSchema = z.array(carrierSchema).max(20, 'List at most 20 carriers.').refine(carrierNamesAreUnique, 'Give each carrier its own name.');

// Darker roasts degas faster [Smrke et al. 2017]: light +1 day, medium-dark, dark and French −1
// (from memory).
const defaultRestAdjustDays = { light: 1, medium: 0, 'medium-dark': -1, dark: -1, french: -1 };
// Invented prices for the shop to replace.
const defaultRoastedBagPriceCents = { '12oz': 1_800, '1lb': 2_300, '2lb': 4_400 };
// Weight bands with invented prices for the shop to replace with its carrier's (Restday defaults, no
// carrier's rate card).
const defaultShipping = {
  bands: [
    { maxGrams: 500, cents: 695 },
    { maxGrams: 1_000, cents: 895 },
    { maxGrams: 2_000, cents: 1_195 },
    { maxGrams: 5_000, cents: 1_695 },
    { maxGrams: 10_000, cents: 2_495 },
  ],
  // A valve bag with its label, and a box with padding (Restday defaults).
  bagTareGrams: 20,
  boxTareGrams: 180,
};
const DEFAULT_DAY_CAPACITY_GRAMS = 60_000;
const DEFAULT_SUBSCRIPTION_DISCOUNT_PCT = 10;
const DEFAULT_RENEWAL_REMINDER_DAYS = 3;

/**
 * The shop's place of business as a packed food label must state it (the shop's name comes first on
 * the label; this is the street address under it).
 */
export const placeOfBusinessSchema = postalAddressInputSchema.omit({ name: true });
export type PlaceOfBusiness = z.output<typeof placeOfBusinessSchema>;

export const shopSettingsSchema = z
  .object({
    timeZone: z.string().refine(isValidTimeZone, 'Use an IANA time zone such as America/Denver.'),
    currency: z.enum(shopCurrencies as [CurrencyCode, ...CurrencyCode[]]).default('usd'),
    roastWeekdays: weekdayList,
    cutoff: z.object({
      time: z.string().refine(isClockTime, 'Use 24-hour HH:MM, e.g. 12:00.'),
      daysBefore: wholeDays(14),
    }),
    shipWeekdays: weekdayList,
    transitDays: wholeDays(14),
    degasHoldDays: wholeDays(14),
    /** Hold a roasted parcel until it will be ready on arrival, or ship after the degassing hold. */
    shipPolicy: z.enum(shipPolicies).default('ready_on_arrival'),
    /** Hold a roasted parcel whose transit would cross a weekend to a ship day from which it does not. */
    holdOverWeekend: z.boolean().default(true),
    restDays: z.object({ filter: wholeDays(60), espresso: wholeDays(60) }),
    restAdjustDays: z
      .object(Object.fromEntries(roastLevels.map((level) => [level, z.number().int().min(-14).max(14)])) as Record<(typeof roastLevels)[number], z.ZodNumber>)
      .default(() => ({ ...defaultRestAdjustDays })),
    bestBeforeDays: z.number().int().min(1).max(365),
    overagePct: percent(20),
    dayCapacityGrams: z.number().int().positive().max(10_000_000).default(DEFAULT_DAY_CAPACITY_GRAMS),
    roaster: roasterSchema,
    lossModel: lossModelSchema,
    lossModelMinBatches: z.number().int().min(1).max(100).default(DEFAULT_LOSS_MIN_BATCHES),
    roastedBagPriceCents: z
      .object(Object.fromEntries(roastedBagSizes.map((size) => [size, z.number().int().min(0)])) as Record<(typeof roastedBagSizes)[number], z.ZodNumber>)
      .default(() => ({ ...defaultRoastedBagPriceCents })),
    subscriptionDiscountPct: percent(50).default(DEFAULT_SUBSCRIPTION_DISCOUNT_PCT),
    /** Days before a subscription's charge that the renewal reminder goes out; 0 sends none. */
    renewalReminderDays: wholeDays(14).default(DEFAULT_RENEWAL_REMINDER_DAYS),
    shipping: shippingSchema.default(() => ({ ...defaultShipping, bands: defaultShipping.bands.map((band) => ({ ...band })) })),
    /** Null only until the owner first saves the settings: a shop installed before labels carried it. */
    placeOfBusiness: placeOfBusinessSchema.nullable(),
    /** Carriers the shipped e-mail links to; a carrier not listed gets its tracking number alone. */
    carriers: carrierListSchema.default(() => []),
  })
  .refine((settings) => settings.bestBeforeDays > Math.max(settings.restDays.filter, settings.restDays.espresso), {
    message: 'The best-before date must come after the coffee is ready.',
    path: ['bestBeforeDays'],
  });

export type ShopSettings = z.output<typeof shopSettingsSchema>;
export type ShopSettingsInput = z.input<typeof shopSettingsSchema>;

/** `PUT /api/roastery/settings`: as the GET reads, and the place of business is required, since every bag label prints it. */
export const shopSettingsUpdateSchema = shopSettingsSchema.refine((settings) => settings.placeOfBusiness !== null, {
  message: 'Enter the shop’s postal address: every bag label prints it.',
  path: ['placeOfBusiness'],
});

/** The product's defaults; the demo seed sets its own time zone (America/Denver). */
export const defaultShopSettings: ShopSettings = shopSettingsSchema.parse({
  timeZone: 'America/New_York',
  currency: 'usd',
  // Restday defaults: roast three days a week, ship on weekdays (roast to order, ship the next
  // day: common practice).
  roastWeekdays: ['mon', 'wed', 'fri'],
  cutoff: { time: '12:00', daysBefore: 1 },
  shipWeekdays: ['mon', 'tue', 'wed', 'thu', 'fri'],
  transitDays: 3,
  // Roasted coffee gives off most of its CO2 in the first 24–48 h (common practice).
  degasHoldDays: 1,
  // The product promises a bag ready to brew when it lands; no parcel sits over a weekend (common
  // practice).
  shipPolicy: 'ready_on_arrival',
  holdOverWeekend: true,
  // Filter 2 days, espresso 7, best-before 28 days (the product's defaults).
  restDays: { filter: 2, espresso: 7 },
  restAdjustDays: defaultRestAdjustDays,
  bestBeforeDays: 28,
  overagePct: 2,
  dayCapacityGrams: DEFAULT_DAY_CAPACITY_GRAMS,
  // A 12 kg shop roaster at the usual 50–80 % load (from memory).
  roaster: { capacityGrams: 12_000, minLoadPct: 50, maxLoadPct: 80 },
  lossModel: defaultLossModel,
  lossModelMinBatches: DEFAULT_LOSS_MIN_BATCHES,
  roastedBagPriceCents: defaultRoastedBagPriceCents,
  subscriptionDiscountPct: DEFAULT_SUBSCRIPTION_DISCOUNT_PCT,
  renewalReminderDays: DEFAULT_RENEWAL_REMINDER_DAYS,
  shipping: defaultShipping,
  placeOfBusiness: null,
  carriers: [],
} satisfies ShopSettingsInput);
