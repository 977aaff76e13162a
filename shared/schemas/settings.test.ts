import { describe, expect, it } from 'vitest';
import { defaultShopSettings, shopSettingsSchema, type ShopSettingsInput } from './settings';

function withChange(change: (settings: ShopSettingsInput) => void): ShopSettingsInput {
  const settings = structuredClone(defaultShopSettings) as ShopSettingsInput;
  change(settings);
  return settings;
}

function errorPaths(input: unknown): string[] {
  const result = shopSettingsSchema.safeParse(input);
  return result.success ? [] : result.error.issues.map((issue) => issue.path.join('.'));
}

describe('shop settings', () => {
  it("holds the product's defaults", () => {
    expect(defaultShopSettings.restDays).toEqual({ filter: 2, espresso: 7 }); // product defaults
    expect(defaultShopSettings.bestBeforeDays).toBe(28); // product defaults
    expect(defaultShopSettings.degasHoldDays).toBe(1); // most CO2 in the first 24–48 h (common practice)
    expect(defaultShopSettings.roaster).toMatchObject({ minLoadPct: 50, maxLoadPct: 80 }); // usual load (from memory)
    expect(defaultShopSettings.lossModel.medium).toEqual({ minPct: 14, maxPct: 16, defaultPct: 15 }); // usual trade figures (from memory)
    expect(defaultShopSettings.lossModelMinBatches).toBe(3);
    expect(defaultShopSettings.timeZone).toBe('America/New_York');
    // Ready to brew on arrival and no parcel over a weekend (the product's promise; common practice).
    expect(defaultShopSettings).toMatchObject({ shipPolicy: 'ready_on_arrival', holdOverWeekend: true });
    // Darker roasts degas faster (Smrke et al. 2017); the days from memory (usual trade figures).
    expect(defaultShopSettings.restAdjustDays).toEqual({ light: 1, medium: 0, 'medium-dark': -1, dark: -1, french: -1 });
    expect(shopSettingsSchema.parse(defaultShopSettings)).toEqual(defaultShopSettings);
  });

  it("fills in Restday's added fields when a body carries only the first version's", () => {
    const minimal = withChange((settings) => {
      for (const key of [
        'currency',
        'restAdjustDays',
        'dayCapacityGrams',
        'lossModelMinBatches',
        'roastedBagPriceCents',
        'subscriptionDiscountPct',
        'shipping',
        'shipPolicy',
        'holdOverWeekend',
      ] as const) {
        delete settings[key];
      }
    });
    expect(shopSettingsSchema.parse(minimal)).toEqual(defaultShopSettings);
  });

  it.each([
    ['an unknown time zone', (s: ShopSettingsInput) => void (s.timeZone = 'Mars/Base'), 'timeZone'],
    ['a cutoff at 24:00', (s: ShopSettingsInput) => void (s.cutoff.time = '24:00'), 'cutoff.time'],
    ['no roast day', (s: ShopSettingsInput) => void (s.roastWeekdays = []), 'roastWeekdays'],
    ['a day twice', (s: ShopSettingsInput) => void (s.shipWeekdays = ['mon', 'mon']), 'shipWeekdays'],
    ['a preferred load under the 25 % floor', (s: ShopSettingsInput) => void (s.roaster.minLoadPct = 20), 'roaster.minLoadPct'],
    [
      'a minimum load over the maximum',
      (s: ShopSettingsInput) => void (s.roaster = { capacityGrams: 12_000, minLoadPct: 85, maxLoadPct: 80 }),
      'roaster.minLoadPct',
    ],
    [
      'a loss default outside its range',
      (s: ShopSettingsInput) => void (s.lossModel.dark = { minPct: 18, maxPct: 20, defaultPct: 21 }),
      'lossModel.dark.defaultPct',
    ],
    ['an overage with three decimals', (s: ShopSettingsInput) => void (s.overagePct = 2.125), 'overagePct'],
    ['a best-before before the coffee is ready', (s: ShopSettingsInput) => void (s.bestBeforeDays = 7), 'bestBeforeDays'],
    [
      'shipping bands out of order',
      (s: ShopSettingsInput) =>
        void (s.shipping = {
          bands: [
            { maxGrams: 1000, cents: 900 },
            { maxGrams: 500, cents: 700 },
          ],
          bagTareGrams: 20,
          boxTareGrams: 180,
        }),
      'shipping.bands',
    ],
    [
      'a box heavier than every band',
      (s: ShopSettingsInput) => void (s.shipping = { bands: [{ maxGrams: 100, cents: 900 }], bagTareGrams: 20, boxTareGrams: 180 }),
      'shipping.bands',
    ],
    ['an unknown currency', (s: ShopSettingsInput) => void ((s as Record<string, unknown>).currency = 'xyz'), 'currency'],
  ])('rejects %s, naming the field', (_, change, path) => {
    expect(errorPaths(withChange(change))).toContain(path);
  });
});
