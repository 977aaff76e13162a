// Invented Roast Journal entries, written straight to the test database.
import { journalEntries } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';

/** A popper roast by `userId` of `lotId`: 80 g → 68 g, first crack 3:00, end 3:25 (15 % loss, medium). */
export async function createJournalEntry(userId: string, lotId: string, fields: Partial<typeof journalEntries.$inferInsert> = {}): Promise<string> {
  const [row] = await getTestDb()
    .insert(journalEntries)
    .values({
      userId,
      lotId,
      device: 'popper',
      roastedOn: '2026-11-20',
      greenGrams: 80,
      roastedGrams: 68,
      yellowSeconds: 150,
      firstCrackSeconds: 180,
      endSeconds: 205,
      estimatedLevel: 'medium',
      lossPct: 15,
      developmentSeconds: 25,
      ...fields,
    })
    .returning({ id: journalEntries.id });
  return row!.id;
}
