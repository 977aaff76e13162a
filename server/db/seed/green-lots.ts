// The invented green lots as rows, with their quantity price breaks.
import type * as schema from '../schema/index';
import { demoLots, type DemoLot } from './demo-lots';
import type { Random } from './random';
import type { Insert, SeedClock } from './scenario-values';

export type DemoCatalogue = {
  lots: Insert<typeof schema.lots>[];
  priceBreaks: Insert<typeof schema.lotPriceBreaks>[];
  lotId(code: string): string;
  lotCodeOf(lotId: string): string;
  lotByCode(code: string): DemoLot;
  /** Codes of the lots staff may pick for Roaster's Rotation. */
  rotationLots: string[];
};

export function demoCatalogue(rng: Random, clock: SeedClock): DemoCatalogue {
  const lotIdByCode = new Map<string, string>();
  const lotsByCode = new Map<string, DemoLot>(demoLots.map((l) => [l.code, l]));
  const lots: Insert<typeof schema.lots>[] = [];
  const priceBreaks: Insert<typeof schema.lotPriceBreaks>[] = [];
  for (const lot of demoLots) {
    const id = rng.uuid();
    lotIdByCode.set(lot.code, id);
    const createdAt = clock.daysAgo(lot.arrivedDaysAgo, 600);
    const { priceBreaks: breaks, arrivedDaysAgo: _arrived, rotation: _rotation, ...columns } = lot;
    // Invented staff habit: reorder once a lot is down to 20 lb (9,072 g), so low lots raise the alert.
    lots.push({ id, ...columns, reorderPointGrams: 9_072, isListed: true, createdAt, updatedAt: createdAt });
    for (const [minGrams, pricePerKgCents] of breaks) priceBreaks.push({ id: rng.uuid(), lotId: id, minGrams, pricePerKgCents });
  }
  const lotCodeById = new Map([...lotIdByCode].map(([code, id]) => [id, code]));
  return {
    lots,
    priceBreaks,
    lotId: (code) => lotIdByCode.get(code) as string,
    lotCodeOf: (lotId) => lotCodeById.get(lotId) as string,
    lotByCode: (code) => lotsByCode.get(code) as DemoLot,
    rotationLots: demoLots.filter((l) => l.rotation).map((l) => l.code),
  };
}
