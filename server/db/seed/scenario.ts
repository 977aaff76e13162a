// The demo scenario, built in memory from its parts. The parts run in this order because they draw
// from one PRNG stream: reordering them changes every demo value after the move.
import { demoAccounts } from './accounts';
import { demoGreenOrders } from './green-orders';
import { demoCatalogue } from './green-lots';
import { demoOutbox, markOneRetrying } from './outbox';
import { DEMO_SEED, mulberry32 } from './random';
import { demoBatches, queueRoastedEmails } from './roast-batches';
import { demoJournalEntries } from './roast-journal';
import { demoRotationPicks } from './rotation-picks';
import type { ScenarioContext } from './scenario-context';
import { seedClock } from './scenario-values';
import { demoRoastDays, demoShopSettings } from './shop';
import { demoStockHistory } from './stock-history';
import { demoSubscriptions } from './subscriptions';

export type DemoScenario = ReturnType<typeof buildDemoScenario>;

/** Build every demo row in memory (pure: same `now` and hash → same rows). */
export function buildDemoScenario(now: Date, passwordHash: string) {
  const rng = mulberry32(DEMO_SEED);
  const clock = seedClock(now);
  const settings = demoShopSettings(clock);
  const { roastDays, cal } = demoRoastDays(clock, settings);
  const accounts = demoAccounts(rng, clock, passwordHash);
  const catalogue = demoCatalogue(rng, clock);
  const outbox = demoOutbox(rng, now, accounts.emailOf);
  const ctx: ScenarioContext = { rng, clock, settings, cal, accounts, catalogue, outbox };

  const { rotationPicks, pickedLotOn } = demoRotationPicks(ctx);
  const subscribed = demoSubscriptions(ctx, pickedLotOn);
  const roasted = demoBatches(ctx, subscribed.roastedLines);
  queueRoastedEmails(ctx, subscribed.roastedLines);
  const green = demoGreenOrders(ctx);
  const journalEntries = demoJournalEntries(ctx, green.orders, green.orderItems);
  const stockMovements = [...roasted.stockMovements, ...green.stockMovements];
  stockMovements.push(...demoStockHistory(ctx, stockMovements));
  markOneRetrying(outbox);

  return {
    settings,
    roastDays,
    users: accounts.users,
    addresses: accounts.addresses,
    lots: catalogue.lots,
    priceBreaks: catalogue.priceBreaks,
    subscriptions: subscribed.subscriptions,
    deliveries: subscribed.deliveries,
    orders: [...subscribed.orders, ...green.orders],
    orderItems: [...subscribed.orderItems, ...green.orderItems],
    rotationPicks,
    batches: roasted.batches,
    bagAllocations: roasted.bagAllocations,
    stockMovements,
    journalEntries,
    outbox: outbox.rows,
  };
}
