// Green stock history: invented samples, counts and losses, then each lot's arrival sized so that
// the sum of a lot's movements is its stock on hand.
import type * as schema from '../schema/index';
import { demoLots } from './demo-lots';
import type { ScenarioContext } from './scenario-context';
import type { Insert } from './scenario-values';

export function demoStockHistory(
  { rng, clock, accounts, catalogue }: ScenarioContext,
  movementsSoFar: Insert<typeof schema.stockMovements>[],
): Insert<typeof schema.stockMovements>[] {
  const { daysAgo } = clock;
  const { lotId } = catalogue;
  const { roasterId, packerId } = accounts;
  const history: Insert<typeof schema.stockMovements>[] = [
    {
      id: rng.uuid(),
      lotId: lotId('WR-24-ETH-01'),
      deltaGrams: -227,
      reason: 'sample',
      note: 'Cupping samples for the (invented) Wrenfield coffee club',
      actorId: roasterId,
      createdAt: daysAgo(50),
    },
    {
      id: rng.uuid(),
      lotId: lotId('WR-24-GTM-01'),
      deltaGrams: -140,
      reason: 'count',
      note: 'Stock count: spilled sack corner (invented)',
      actorId: packerId,
      createdAt: daysAgo(21),
    },
    {
      id: rng.uuid(),
      lotId: lotId('WR-24-BRA-01'),
      deltaGrams: -310,
      reason: 'loss',
      note: 'Torn sack, swept beans discarded (invented)',
      actorId: packerId,
      createdAt: daysAgo(44),
    },
  ];
  const before = [...movementsSoFar, ...history];
  for (const lot of demoLots) {
    const moved = before.filter((m) => m.lotId === lotId(lot.code)).reduce((sum, m) => sum + m.deltaGrams, 0);
    history.push({
      id: rng.uuid(),
      lotId: lotId(lot.code),
      deltaGrams: lot.stockGrams - moved,
      reason: 'arrival',
      note: `${Math.round((lot.stockGrams - moved) / 1000)} kg in hermetic-lined sacks from the (invented) importer`,
      actorId: roasterId,
      createdAt: daysAgo(lot.arrivedDaysAgo, 600),
    });
  }
  return history;
}
