// What the parts of the demo scenario that come after the shop, its people and its lots share.
import type { DemoAccounts } from './accounts';
import type { DemoCalendar } from './demo-dates';
import type { DemoCatalogue } from './green-lots';
import type { DemoOutbox } from './outbox';
import type { Random } from './random';
import type { SeedClock } from './scenario-values';
import type { DemoShopSettings } from './shop';

export type ScenarioContext = {
  /** One PRNG stream for the whole scenario: the parts draw from it in a fixed order. */
  rng: Random;
  clock: SeedClock;
  settings: DemoShopSettings;
  cal: DemoCalendar;
  accounts: DemoAccounts;
  catalogue: DemoCatalogue;
  outbox: DemoOutbox;
};
