import { randomUUID } from 'node:crypto';
import { asc, eq, sql } from 'drizzle-orm';
import { describe, expect, it } from 'vitest';
import type { Db } from '../../server/db/client';
import * as schema from '../../server/db/schema/index';
import { seedDemo, seededTables } from '../../server/db/seed/index';
import { emailPayloadSchemas, isEmailTemplateName, renderSubject } from '../../emails/index';
import { getTestDb } from '../setup/test-db';

// The database itself refuses impossible rows, whatever the code above it does. Every test runs in
// a transaction that is rolled back, so the shared test database is left as it was found.

class Rollback extends Error {}

async function inRolledBackTransaction<T>(work: (tx: Db) => Promise<T>): Promise<T> {
  let result: T | undefined;
  try {
    await getTestDb().transaction(async (tx) => {
      // A transaction offers the same query API as the database handle (nested ones are savepoints).
      result = await work(tx as unknown as Db);
      throw new Rollback();
    });
  } catch (error) {
    if (!(error instanceof Rollback)) throw error;
  }
  return result as T;
}

/** The PostgreSQL error under drizzle's wrapper. */
function pgErrorOf(error: unknown): { code?: string; constraint?: string } {
  let current: unknown = error;
  for (let depth = 0; current && depth < 5; depth++) {
    const candidate = current as { code?: string; constraint?: string; cause?: unknown };
    if (typeof candidate.code === 'string' && /^[0-9A-Z]{5}$/.test(candidate.code)) return { code: candidate.code, constraint: candidate.constraint };
    current = candidate.cause;
  }
  return {};
}

const CHECK_VIOLATION = '23514';
const UNIQUE_VIOLATION = '23505';

/** Runs `work` in a savepoint and expects PostgreSQL to refuse it with `code` on `constraint`. */
async function expectRefused(tx: Db, code: string, constraint: string, work: (sp: Db) => Promise<unknown>): Promise<void> {
  const error = await tx
    .transaction(async (sp) => {
      await work(sp as unknown as Db);
    })
    .then(
      () => null,
      (caught: unknown) => caught,
    );
  expect(error, `the database accepted a row that ${constraint} should refuse`).not.toBeNull();
  expect(pgErrorOf(error)).toEqual({ code, constraint });
}

const unique = () => randomUUID().slice(0, 8).toUpperCase();

function lotRow(overrides: Partial<typeof schema.lots.$inferInsert> = {}): typeof schema.lots.$inferInsert {
  return {
    code: `T-${unique()}`,
    name: 'Test lot',
    origin: 'Colombia',
    region: 'Huila',
    producer: 'Test producer (invented)',
    variety: 'Caturra',
    process: 'washed',
    altitudeM: 1700,
    cropYear: 2024,
    moisturePct: 10.8,
    suggestedLevel: 'medium',
    allowedLevels: ['light', 'medium', 'dark'],
    stockGrams: 5000,
    pricePerKgCents: 2400,
    ...overrides,
  };
}

async function insertLot(db: Db, overrides: Partial<typeof schema.lots.$inferInsert> = {}) {
  const [lot] = await db.insert(schema.lots).values(lotRow(overrides)).returning();
  return lot as typeof schema.lots.$inferSelect;
}

async function insertUser(db: Db) {
  const [user] = await db
    .insert(schema.users)
    .values({ email: `t-${unique().toLowerCase()}@example.test`, name: 'Test Customer', passwordHash: 'not-a-real-hash' })
    .returning();
  return user as typeof schema.users.$inferSelect;
}

const address = { name: 'Test Customer', line1: '1 Test Lane', city: 'Wrenfield', region: 'CO', postalCode: '81600', country: 'US' };

describe('database constraints', () => {
  it('lots — when stock would go below zero, then the row is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      await expectRefused(tx, CHECK_VIOLATION, 'lots_stock_grams_non_negative', (sp) => sp.insert(schema.lots).values(lotRow({ stockGrams: -1 })));

      // The last line of defence for concurrent checkouts: a decrement past zero fails.
      const lot = await insertLot(tx, { stockGrams: 500 });
      await expectRefused(tx, CHECK_VIOLATION, 'lots_stock_grams_non_negative', (sp) =>
        sp
          .update(schema.lots)
          .set({ stockGrams: sql`${schema.lots.stockGrams} - 908` })
          .where(eq(schema.lots.id, lot.id)),
      );
      const [after] = await tx.select({ stockGrams: schema.lots.stockGrams }).from(schema.lots).where(eq(schema.lots.id, lot.id));
      expect(after?.stockGrams).toBe(500);
    });
  });

  it('lots — when the code is already taken, then the second lot is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      const lot = await insertLot(tx);
      await expectRefused(tx, UNIQUE_VIOLATION, 'lots_code_key', (sp) => sp.insert(schema.lots).values(lotRow({ code: lot.code })));
    });
  });

  it('lots — when the suggested level is not an allowed level, or a descriptor is out of range, then the row is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      await expectRefused(tx, CHECK_VIOLATION, 'lots_suggested_level_allowed', (sp) =>
        sp.insert(schema.lots).values(lotRow({ suggestedLevel: 'french', allowedLevels: ['light', 'medium'] })),
      );
      // Moisture above 20 % is no green coffee a shop would sell (SCA: 10–12 % on import).
      await expectRefused(tx, CHECK_VIOLATION, 'lots_moisture_range', (sp) => sp.insert(schema.lots).values(lotRow({ moisturePct: 20.5 })));
      // Cupping scores are out of 100 (SCA Arabica Cupping Form).
      await expectRefused(tx, CHECK_VIOLATION, 'lots_cupping_score_range', (sp) => sp.insert(schema.lots).values(lotRow({ cuppingScore: 100.25 })));
      await expectRefused(tx, CHECK_VIOLATION, 'lots_price_per_kg_positive', (sp) => sp.insert(schema.lots).values(lotRow({ pricePerKgCents: 0 })));
    });
  });

  it('batches — when roasted weight is not below green weight, then the batch is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      const lot = await insertLot(tx);
      const batch = { roastDate: '2025-03-11', lotId: lot.id, roastLevel: 'medium' as const, lossPct: 15, withinExpected: true };
      await expectRefused(tx, CHECK_VIOLATION, 'batches_roasted_less_than_green', (sp) =>
        sp.insert(schema.batches).values({ ...batch, greenGramsIn: 4000, roastedGramsOut: 4000 }),
      );
      await expectRefused(tx, CHECK_VIOLATION, 'batches_roasted_less_than_green', (sp) =>
        sp.insert(schema.batches).values({ ...batch, greenGramsIn: 4000, roastedGramsOut: 4100 }),
      );
      // Roasting always loses mass (14–20 % typical, Barista Hustle RS 3.05): 3400 g out of 4000 g is fine.
      await tx.insert(schema.batches).values({ ...batch, greenGramsIn: 4000, roastedGramsOut: 3400 });
    });
  });

  it('journal entries — when roasted weight is not below green weight, then the entry is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      const [lot, user] = [await insertLot(tx), await insertUser(tx)];
      await expectRefused(tx, CHECK_VIOLATION, 'journal_entries_roasted_less_than_green', (sp) =>
        sp.insert(schema.journalEntries).values({
          userId: user.id,
          lotId: lot.id,
          device: 'popper',
          roastedOn: '2025-03-10',
          greenGrams: 80,
          roastedGrams: 80,
          endSeconds: 240,
          estimatedLevel: 'light',
          lossPct: 0.5,
        }),
      );
    });
  });

  it('email outbox — when a message with the same dedupe key is queued again, then it is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      const message = { template: 'shipped', toAddress: 'someone@example.test', subject: 'Shipped', dedupeKey: `shipped:${randomUUID()}` };
      await tx.insert(schema.emailOutbox).values(message);
      await expectRefused(tx, UNIQUE_VIOLATION, 'email_outbox_dedupe_key_key', (sp) => sp.insert(schema.emailOutbox).values({ ...message, subject: 'Again' }));
    });
  });

  it('orders — when the total is not subtotal less discount plus shipping, or the discount exceeds the subtotal, then the order is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      const user = await insertUser(tx);
      const order = { userId: user.id, kind: 'green' as const, shippingAddress: address };
      await expectRefused(tx, CHECK_VIOLATION, 'orders_total_adds_up', (sp) =>
        sp.insert(schema.orders).values({ ...order, subtotalCents: 2400, shippingCents: 850, totalCents: 2400 }),
      );
      await expectRefused(tx, CHECK_VIOLATION, 'orders_total_adds_up', (sp) =>
        sp.insert(schema.orders).values({ ...order, subtotalCents: 3600, discountCents: 360, shippingCents: 895, totalCents: 4495 }),
      );
      await expectRefused(tx, CHECK_VIOLATION, 'orders_discount_within_subtotal', (sp) =>
        sp.insert(schema.orders).values({ ...order, subtotalCents: 100, discountCents: 200, shippingCents: 895, totalCents: 795 }),
      );
      await tx.insert(schema.orders).values({ ...order, subtotalCents: 2400, shippingCents: 850, totalCents: 3250 });
      // $36.00 of bags less $3.60 discount plus $8.95 shipping = $41.35.
      await tx.insert(schema.orders).values({ ...order, subtotalCents: 3600, discountCents: 360, shippingCents: 895, totalCents: 4135 });
    });
  });

  it('order items — when the fill weight does not match the bag size, then the line is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      const [lot, user] = [await insertLot(tx), await insertUser(tx)];
      const [order] = await tx
        .insert(schema.orders)
        .values({ userId: user.id, kind: 'green', shippingAddress: address, subtotalCents: 1089, shippingCents: 0, totalCents: 1089 })
        .returning();
      const line = {
        orderId: order?.id as string,
        lotId: lot.id,
        kind: 'green' as const,
        size: '1lb' as const,
        quantity: 1,
        unitPriceCents: 1089,
        lineTotalCents: 1089,
      };
      // 1 lb = 453.59237 g (NIST SP 811); the bag is filled to 454 g, never 453.
      await expectRefused(tx, CHECK_VIOLATION, 'order_items_fill_grams_matches_size', (sp) => sp.insert(schema.orderItems).values({ ...line, fillGrams: 453 }));
      await tx.insert(schema.orderItems).values({ ...line, fillGrams: 454 });
    });
  });

  it('shop settings — when a second settings row is added, then it is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      await expectRefused(tx, CHECK_VIOLATION, 'shop_settings_single_row', (sp) =>
        sp.insert(schema.shopSettings).values({ id: 2, shopName: 'Second shop', timeZone: 'America/Denver' }),
      );
    });
  });

  it('users — when an e-mail is not lower-case, then the user is refused', async () => {
    await inRolledBackTransaction(async (tx) => {
      await expectRefused(tx, CHECK_VIOLATION, 'users_email_lower_case', (sp) =>
        sp.insert(schema.users).values({ email: `Mixed.${unique()}@Example.test`, name: 'Mixed Case', passwordHash: 'x' }),
      );
    });
  });
});

describe('demo scenario seed', () => {
  const now = new Date('2025-03-11T17:20:00Z'); // a Tuesday (a roast day) at 11:20 in Denver

  async function counts(db: Db): Promise<Record<string, number>> {
    const out: Record<string, number> = {};
    for (const [name, table] of Object.entries(seededTables)) {
      const [row] = await db.select({ n: sql<number>`count(*)::int` }).from(table);
      out[name] = row?.n ?? 0;
    }
    return out;
  }

  /** Start from a database without a shop (other test files may have saved settings). */
  async function withoutShop(db: Db): Promise<void> {
    await db.delete(schema.shopSettings);
  }

  it('seedDemo — when run twice, then the second run changes nothing and says so', async () => {
    await inRolledBackTransaction(async (tx) => {
      await withoutShop(tx);
      const before = await counts(tx);
      const started = performance.now();
      expect(await seedDemo(tx, { now })).toEqual({ seeded: true });
      const elapsedMs = performance.now() - started;
      const afterFirst = await counts(tx);
      expect(await seedDemo(tx, { now })).toEqual({ seeded: false });
      expect(await counts(tx)).toEqual(afterFirst);

      // The demo's promised scale: 8–12 lots, 20+ customers, 30+ subscriptions, something on every screen.
      expect(afterFirst.lots! - before.lots!).toBe(10);
      expect(afterFirst.users! - before.users!).toBeGreaterThanOrEqual(23);
      expect(afterFirst.subscriptions! - before.subscriptions!).toBeGreaterThanOrEqual(30);
      for (const table of ['orders', 'deliveries', 'batches', 'bagAllocations', 'journalEntries', 'emailOutbox', 'stockMovements'] as const) {
        expect(afterFirst[table]! - before[table]!, table).toBeGreaterThan(0);
      }
      expect(elapsedMs).toBeLessThan(3000);
    });
  });

  it('seedDemo — when run from scratch twice with the same `now`, then it writes the same rows', async () => {
    // One after another: a transaction is one connection, which runs one query at a time.
    const snapshot = async (db: Db) => [
      await db
        .select()
        .from(schema.users)
        .where(sql`${schema.users.email} like '%@wrenfield.test' or ${schema.users.email} like '%.%@example.test'`)
        .orderBy(asc(schema.users.id)),
      await db
        .select()
        .from(schema.lots)
        .where(sql`${schema.lots.code} like 'WR-%'`)
        .orderBy(asc(schema.lots.id)),
      await db
        .select()
        .from(schema.subscriptions)
        .where(sql`${schema.subscriptions.stripeCustomerId} like 'cus_demo_%'`)
        .orderBy(asc(schema.subscriptions.id)),
      await db
        .select()
        .from(schema.orders)
        .where(sql`${schema.orders.stripeCheckoutSessionId} like 'cs_test_demo_%' or ${schema.orders.stripeInvoiceId} like 'in_demo_%'`)
        .orderBy(asc(schema.orders.id)),
      await db.select().from(schema.batches).orderBy(asc(schema.batches.id)),
      await db.select().from(schema.emailOutbox).orderBy(asc(schema.emailOutbox.dedupeKey)),
    ];
    const first = await inRolledBackTransaction(async (tx) => {
      await withoutShop(tx);
      await seedDemo(tx, { now });
      return snapshot(tx);
    });
    const second = await inRolledBackTransaction(async (tx) => {
      await withoutShop(tx);
      await seedDemo(tx, { now });
      return snapshot(tx);
    });
    expect(first[1]).toHaveLength(10);
    expect(second).toEqual(first);
  });

  it('seedDemo — every outbox row it writes carries a payload its template accepts', async () => {
    await inRolledBackTransaction(async (tx) => {
      await withoutShop(tx);
      // Other test files may have left messages of their own: look only at the seed's.
      const earlier = new Set((await tx.select({ id: schema.emailOutbox.id }).from(schema.emailOutbox)).map((row) => row.id));
      await seedDemo(tx, { now });
      const rows = (await tx.select().from(schema.emailOutbox)).filter((row) => !earlier.has(row.id));
      expect(rows.length).toBeGreaterThan(0);

      // The relay parses each row like this before it renders; a misfit would turn into a dead letter.
      const misfits = rows.flatMap((row) => {
        if (!isEmailTemplateName(row.template)) return [`${row.dedupeKey}: no template "${row.template}"`];
        const parsed = emailPayloadSchemas[row.template].safeParse(row.payload);
        if (!parsed.success) return [`${row.dedupeKey}: ${parsed.error.message}`];
        // Subjects come from the templates, as on live rows.
        const subject = renderSubject(row.template, parsed.data);
        return subject === row.subject ? [] : [`${row.dedupeKey}: subject "${row.subject}", the template's is "${subject}"`];
      });
      expect(misfits).toEqual([]);
      // The rest-day e-mails still to come are among them: a misfit there would only surface days later.
      expect(rows.some((row) => row.template === 'rest-day' && row.status === 'pending')).toBe(true);
    });
  });

  it('seedDemo — then every lot’s stock equals the sum of its stock movements, and every past roasted order traces to a batch', async () => {
    await inRolledBackTransaction(async (tx) => {
      await withoutShop(tx);
      await seedDemo(tx, { now });
      const mismatched = await tx.execute(sql`
        select l.code from ${schema.lots} l
        left join ${schema.stockMovements} m on m.lot_id = l.id
        where l.code like 'WR-%'
        group by l.id, l.code, l.stock_grams
        having l.stock_grams <> coalesce(sum(m.delta_grams), 0)`);
      expect(mismatched.rows).toEqual([]);
      const untraced = await tx.execute(sql`
        select o.id from ${schema.orders} o
        where o.kind = 'roasted' and o.status in ('roasted', 'packed', 'shipped') and o.stripe_invoice_id like 'in_demo_%'
          and not exists (select 1 from ${schema.bagAllocations} a where a.order_id = o.id)`);
      expect(untraced.rows).toEqual([]);
    });
  });
});
