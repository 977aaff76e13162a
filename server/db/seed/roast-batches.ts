// Batches for past roast days (invented weights; loss drawn around the level default), the bags
// they filled, the green they used, and the "roasted" e-mail of each order they roasted.
import { lossPctOf } from '../../../shared/domain/roast-loss';
import type { RoastLevel } from '../../../shared/domain/vocabulary';
import type * as schema from '../schema/index';
import type { ScenarioContext } from './scenario-context';
import type { Insert } from './scenario-values';
import type { RoastedLine } from './subscriptions';

/** Invented drop times per level: [total seconds, development seconds]. */
const levelSeconds: Record<RoastLevel, [number, number]> = {
  light: [600, 75],
  medium: [660, 100],
  'medium-dark': [720, 125],
  dark: [780, 160],
  french: [840, 200],
};

export function demoBatches({ rng, settings, cal, accounts }: ScenarioContext, roastedLines: RoastedLine[]) {
  const model = settings.lossModel;
  const { roasterId } = accounts;
  const batches: Insert<typeof schema.batches>[] = [];
  const bagAllocations: Insert<typeof schema.bagAllocations>[] = [];
  const stockMovements: Insert<typeof schema.stockMovements>[] = [];
  const groups = new Map<string, RoastedLine[]>();
  for (const line of [...roastedLines].sort((a, b) => (a.roastDate + a.lotId + a.level).localeCompare(b.roastDate + b.lotId + b.level))) {
    const key = `${line.roastDate}|${line.lotId}|${line.level}`;
    groups.set(key, [...(groups.get(key) ?? []), line]);
  }
  const maxLoad = (settings.roasterCapacityGrams * settings.maxLoadPct) / 100;
  const minLoad = (settings.roasterCapacityGrams * settings.minLoadPct) / 100;
  let batchCounter = 0;
  const batchesPerDay = new Map<string, number>();
  for (const [, lines] of groups) {
    const { roastDate, lotId: batchLotId, level } = lines[0] as RoastedLine;
    const loss = model[level];
    const roastedNeeded = lines.reduce((sum, l) => sum + (l.item.quantity as number) * (l.item.fillGrams as number), 0);
    const greenNeeded = Math.ceil((roastedNeeded * (1 + settings.overagePct / 100)) / (1 - loss.defaultPct / 100));
    const count = Math.max(1, Math.ceil(greenNeeded / maxLoad));
    const perBatch = Math.max(minLoad, Math.ceil(greenNeeded / count));
    const groupBatchIds: string[] = [];
    for (let b = 0; b < count; b += 1) {
      batchCounter += 1;
      const nth = batchesPerDay.get(roastDate) ?? 0;
      batchesPerDay.set(roastDate, nth + 1);
      // Every eleventh batch ran long: outside the expected range, so the flag has something to show.
      const lossPct = batchCounter % 11 === 5 ? loss.maxPct + 1.2 : loss.defaultPct + (rng.next() - 0.5) * (loss.maxPct - loss.minPct) * 0.8;
      const greenGramsIn = perBatch + rng.int(0, 9);
      const roastedGramsOut = Math.round(greenGramsIn * (1 - lossPct / 100));
      const recordedLoss = lossPctOf(greenGramsIn, roastedGramsOut);
      const [total, development] = levelSeconds[level];
      const totalSeconds = total + rng.int(-30, 30);
      const id = rng.uuid();
      const createdAt = cal.at(roastDate, `${String(8 + Math.floor(nth / 3)).padStart(2, '0')}:${String((nth % 3) * 20).padStart(2, '0')}`);
      batches.push({
        id,
        roastDate,
        lotId: batchLotId,
        roastLevel: level,
        greenGramsIn,
        roastedGramsOut,
        totalSeconds,
        firstCrackSeconds: totalSeconds - development - rng.int(0, 15),
        operatorId: roasterId,
        lossPct: recordedLoss,
        withinExpected: recordedLoss >= loss.minPct && recordedLoss <= loss.maxPct,
        notes: recordedLoss > loss.maxPct ? 'Ran long: missed the drop by about 20 s (invented)' : '',
        createdAt,
      });
      groupBatchIds.push(id);
      stockMovements.push({
        id: rng.uuid(),
        lotId: batchLotId,
        deltaGrams: -greenGramsIn,
        reason: 'roast',
        note: '',
        batchId: id,
        actorId: roasterId,
        createdAt,
      });
    }
    lines.forEach((line, n) => {
      bagAllocations.push({
        id: rng.uuid(),
        batchId: groupBatchIds[n % groupBatchIds.length] as string,
        orderItemId: line.item.id as string,
        orderId: line.item.orderId,
        bags: line.item.quantity,
        grams: (line.item.quantity as number) * (line.item.fillGrams as number),
        createdAt: cal.at(roastDate, '15:00'),
      });
    });
  }
  return { batches, bagAllocations, stockMovements };
}

/** One "roasted" e-mail per order roasted on a past roast day (each roasted order has one line). */
export function queueRoastedEmails({ cal, outbox }: ScenarioContext, roastedLines: RoastedLine[]): void {
  for (const line of roastedLines) outbox.queue('roasted', line.userId, line.item.orderId, line.roastedEmail, cal.at(line.roastDate, '17:00'));
}
