// Roast Journal entries: invented home roasts of lots the customers bought.
import { estimateLevelFromLoss, lossPctOf } from '../../../shared/domain/roast-loss';
import type { RoastLevel } from '../../../shared/domain/vocabulary';
import { DEMO_SEED, mulberry32, type Random } from './random';
import type * as schema from '../schema/index';
import type { ScenarioContext } from './scenario-context';
import type { Insert } from './scenario-values';

/** Invented home-roaster habits per device: [min, max] green grams and seconds to yellow and to first crack. */
const deviceProfile = {
  popper: { green: [78, 82], yellow: [95, 140], crack: [170, 230] },
  'stovetop-pan': { green: [140, 160], yellow: [240, 300], crack: [480, 560] },
  'drum-home': { green: [240, 260], yellow: [260, 320], crack: [500, 580] },
} as const;
type Device = keyof typeof deviceProfile;
/** Seconds from first crack to the drop, per level reached. */
const afterCrack: Record<RoastLevel, [number, number]> = { light: [5, 12], medium: [20, 30], 'medium-dark': [30, 40], dark: [55, 70], french: [85, 100] };

// The demo customer's own journal (invented roasts): lot, days ago, device.
const journalPlan: [string, number, Device][] = [
  ['WR-24-GTM-01', 31, 'popper'],
  ['WR-24-GTM-01', 27, 'popper'],
  ['WR-24-ETH-01', 24, 'popper'],
  ['WR-24-BRA-01', 19, 'popper'],
  ['WR-24-ETH-01', 12, 'popper'],
  ['WR-24-BRA-01', 6, 'stovetop-pan'],
  ['WR-24-GTM-01', 2, 'popper'],
];

// Other customers' popper roasts of one lot, all a level darker than its suggestion: enough roasts
// by enough customers for the lot page and Green Stock to show home roasters' figures.
const thresholdLot = {
  code: 'WR-24-ETH-01',
  level: 'medium' as RoastLevel,
  roasts: [
    [0, 40],
    [1, 33],
    [2, 26],
    [0, 18],
    [3, 11],
    [1, 5],
  ] as [number, number][],
};

export function demoJournalEntries(
  { rng: mainRng, settings, cal, accounts, catalogue }: ScenarioContext,
  greenOrders: Insert<typeof schema.orders>[],
  greenOrderItems: Insert<typeof schema.orderItems>[],
): Insert<typeof schema.journalEntries>[] {
  const model = settings.lossModel;
  const { today } = cal;
  const { demoCustomerId, customerIds } = accounts;
  const journalEntries: Insert<typeof schema.journalEntries>[] = [];
  const addJournal = (userId: string, code: string, roastedOn: string, device: Device, forced?: { level: RoastLevel; rng: Random }) => {
    const lot = catalogue.lotByCode(code);
    const rng = forced?.rng ?? mainRng;
    const level = forced?.level ?? (rng.chance(0.6) ? lot.suggestedLevel : rng.pick(lot.allowedLevels));
    const p = deviceProfile[device];
    const greenGrams = rng.int(p.green[0], p.green[1]);
    const lossTarget = model[level].minPct + rng.next() * (model[level].maxPct - model[level].minPct);
    const roastedGrams = Math.round(greenGrams * (1 - lossTarget / 100));
    const lossPct = lossPctOf(greenGrams, roastedGrams);
    const yellowSeconds = rng.int(p.yellow[0], p.yellow[1]);
    const firstCrackSeconds = rng.int(p.crack[0], p.crack[1]);
    const endSeconds = firstCrackSeconds + rng.int(afterCrack[level][0], afterCrack[level][1]);
    const createdAt = cal.at(roastedOn, '19:45');
    journalEntries.push({
      id: rng.uuid(),
      userId,
      lotId: catalogue.lotId(code),
      device,
      roastedOn,
      greenGrams,
      roastedGrams,
      yellowSeconds,
      firstCrackSeconds,
      endSeconds,
      levelReached: rng.chance(0.8) ? level : null,
      estimatedLevel: estimateLevelFromLoss(lossPct, model).level,
      lossPct,
      developmentSeconds: endSeconds - firstCrackSeconds,
      notes: rng.pick([
        '',
        'Windy on the porch; took longer to yellow.',
        'Stirred constantly, even colour.',
        'First crack was quiet, went by smell.',
        'Cooled in a colander by the fan.',
      ]),
      createdAt,
      updatedAt: createdAt,
    });
  };
  for (const [code, ago, device] of journalPlan) addJournal(demoCustomerId, code, cal.addDays(today, -ago), device);
  // Their own PRNG stream, so the scenario's main stream (and every demo value after this) is unchanged.
  const thresholdRng = mulberry32(DEMO_SEED ^ 0x16);
  const others = customerIds.filter((id) => id !== demoCustomerId);
  for (const [customer, ago] of thresholdLot.roasts) {
    addJournal(others[customer] as string, thresholdLot.code, cal.addDays(today, -ago), 'popper', { level: thresholdLot.level, rng: thresholdRng });
  }
  // Other customers' roasts of lots from their shipped orders (anonymous in the per-lot summaries).
  for (const order of greenOrders) {
    if (order.status !== 'shipped' || order.userId === demoCustomerId || !order.shipDate) continue;
    const firstDay = cal.addDays(order.shipDate, 4);
    if (firstDay >= today) continue;
    const item = greenOrderItems.find((it) => it.orderId === order.id) as Insert<typeof schema.orderItems>;
    const code = catalogue.lotCodeOf(item.lotId as string);
    addJournal(order.userId, code, firstDay, mainRng.pick(['popper', 'popper', 'drum-home'] as const));
  }
  return journalEntries;
}
