import { sql } from 'drizzle-orm';
import { check, date, index, integer, numeric, pgTable, text, uuid } from 'drizzle-orm/pg-core';
import { users } from './accounts';
import { lots } from './catalog';
import { timestamps } from './common';
import { homeRoastDeviceEnum, roastLevelEnum } from './enums';

/** Roast Journal: a customer's home roast of a lot. Times are seconds from the charge. */
export const journalEntries = pgTable(
  'journal_entries',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    lotId: uuid('lot_id')
      .notNull()
      .references(() => lots.id, { onDelete: 'restrict' }),
    device: homeRoastDeviceEnum('device').notNull(),
    roastedOn: date('roasted_on', { mode: 'string' }).notNull(),
    greenGrams: integer('green_grams').notNull(),
    roastedGrams: integer('roasted_grams').notNull(),
    yellowSeconds: integer('yellow_seconds'),
    firstCrackSeconds: integer('first_crack_seconds'),
    endSeconds: integer('end_seconds').notNull(),
    /** The level the roaster says they reached (optional). */
    levelReached: roastLevelEnum('level_reached'),
    /** The level Restday estimates from the weight loss. */
    estimatedLevel: roastLevelEnum('estimated_level').notNull(),
    lossPct: numeric('loss_pct', { precision: 5, scale: 2, mode: 'number' }).notNull(),
    developmentSeconds: integer('development_seconds'),
    notes: text('notes').notNull().default(''),
    ...timestamps(),
  },
  (t) => [
    index('journal_entries_lot_id_idx').on(t.lotId),
    index('journal_entries_user_id_created_at_idx').on(t.userId, t.createdAt),
    check('journal_entries_green_grams_positive', sql`${t.greenGrams} > 0`),
    check('journal_entries_roasted_grams_positive', sql`${t.roastedGrams} > 0`),
    check('journal_entries_roasted_less_than_green', sql`${t.roastedGrams} < ${t.greenGrams}`),
    check('journal_entries_end_seconds_positive', sql`${t.endSeconds} > 0`),
    check('journal_entries_yellow_before_end', sql`${t.yellowSeconds} is null or (${t.yellowSeconds} > 0 and ${t.yellowSeconds} < ${t.endSeconds})`),
    check(
      'journal_entries_first_crack_before_end',
      sql`${t.firstCrackSeconds} is null or (${t.firstCrackSeconds} > 0 and ${t.firstCrackSeconds} <= ${t.endSeconds})`,
    ),
    check(
      'journal_entries_yellow_before_first_crack',
      sql`${t.yellowSeconds} is null or ${t.firstCrackSeconds} is null or ${t.yellowSeconds} < ${t.firstCrackSeconds}`,
    ),
    check('journal_entries_development_non_negative', sql`${t.developmentSeconds} is null or ${t.developmentSeconds} >= 0`),
    check('journal_entries_loss_pct_range', sql`${t.lossPct} > 0 and ${t.lossPct} < 100`),
  ],
);
