// Invented roast batches and Roaster's Rotation picks, written straight to the test database.
import type { RoastLevel } from '@shared/domain/vocabulary';
import { batches, rotationPicks } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';

/** A recorded batch with `roastedGramsOut` roasted grams (15% loss from the green weight). */
export async function recordBatch(options: { lotId: string; roastDate: string; roastLevel: RoastLevel; roastedGramsOut: number }) {
  const greenGramsIn = Math.ceil(options.roastedGramsOut / 0.85);
  const [batch] = await getTestDb()
    .insert(batches)
    .values({
      lotId: options.lotId,
      roastDate: options.roastDate,
      roastLevel: options.roastLevel,
      greenGramsIn,
      roastedGramsOut: options.roastedGramsOut,
      lossPct: Math.round(((greenGramsIn - options.roastedGramsOut) / greenGramsIn) * 10_000) / 100,
      withinExpected: true,
    })
    .returning({ id: batches.id });
  return batch!;
}

/** The day's Roaster's Rotation lot (replacing any earlier pick for that day). */
export async function pickRotationLot(roastDate: string, lotId: string) {
  await getTestDb().insert(rotationPicks).values({ roastDate, lotId }).onConflictDoUpdate({ target: rotationPicks.roastDate, set: { lotId } });
}
