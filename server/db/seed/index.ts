// DEMO SCENARIO SEED. EVERYTHING IN IT IS INVENTED: the shop (Wrenfield Roastworks), its town
// (Wrenfield, Colorado), its team and customers, their addresses, every farm, producer, cooperative
// and mill, every order, subscription, batch, journal entry and e-mail. Only the coffee origins and
// regions are real places. Payment ids (cs_test_demo_…, sub_demo_…), tracking numbers (WR-DEMO-…)
// and e-mail addresses (.test domains) are fake by construction.
//
// Deterministic: a fixed-seed PRNG (random.ts) drives every choice and makes every id, so the same
// `now` always gives the same rows. Idempotent: a database that already has the shop_settings row is
// left alone ({ seeded: false }). The whole seed runs in one transaction behind an advisory lock.
import { sql } from 'drizzle-orm';
import type { PgTable } from 'drizzle-orm/pg-core';
import type { Role } from '../../../shared/domain/vocabulary';
import { hashPassword } from '../../lib/password-hashing';
import type { Db } from '../client';
import * as schema from '../schema/index';
import { DEMO_CUSTOMER_EMAIL, DEMO_PASSWORD } from './demo-people';
import { DEMO_SEED, mulberry32 } from './random';
import { buildDemoScenario, type DemoScenario } from './scenario';
import type { Insert } from './scenario-values';

export { DEMO_PASSWORD } from './demo-people';
export { buildDemoScenario, type DemoScenario } from './scenario';

/** The demo accounts to print at start-up (all invented). Every demo customer shares the password. */
export const demoSignIns: { role: Role; label: string; email: string; password: string }[] = [
  { role: 'owner', label: 'Owner (Maren Atwood)', email: 'owner@wrenfield.test', password: DEMO_PASSWORD },
  { role: 'staff', label: 'Roaster (Dario Quist)', email: 'roaster@wrenfield.test', password: DEMO_PASSWORD },
  { role: 'staff', label: 'Staff, packing and stock (Lena Porter)', email: 'packer@wrenfield.test', password: DEMO_PASSWORD },
  { role: 'packer', label: 'Packer (Ines Varga)', email: 'dispatch@wrenfield.test', password: DEMO_PASSWORD },
  { role: 'customer', label: 'Home roaster and subscriber (Robin Alder)', email: DEMO_CUSTOMER_EMAIL, password: DEMO_PASSWORD },
];

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** Key of the advisory lock that keeps two concurrent seeds from both inserting. */
const SEED_LOCK_KEY = 7_302_451;

/**
 * Seed the demo scenario unless the database already has a shop. One transaction; about 0.3–0.7 s here.
 * Returns { seeded: false } (and changes nothing) on a database that is already seeded.
 */
export async function seedDemo(db: Db, options: { now: Date }): Promise<{ seeded: boolean }> {
  if (await hasShop(db)) return { seeded: false };
  const scenario = buildDemoScenario(options.now, await hashDemoPassword());
  return db.transaction(async (tx) => {
    await tx.execute(sql`select pg_advisory_xact_lock(${SEED_LOCK_KEY})`);
    if (await hasShop(tx)) return { seeded: false };
    await insertScenario(tx, scenario);
    return { seeded: true };
  });
}

async function hasShop(db: Db | Tx): Promise<boolean> {
  const rows = await db.select({ id: schema.shopSettings.id }).from(schema.shopSettings).limit(1);
  return rows.length > 0;
}

/**
 * Hash the shared demo password once (argon2id, OWASP parameters). The salt is fixed and derived
 * from the demo seed so the seed stays deterministic; acceptable only because the password itself
 * is public demo data. Real sign-ups get a random salt from the auth module.
 */
async function hashDemoPassword(): Promise<string> {
  const salt = mulberry32(DEMO_SEED ^ 0x00a2_90d1).bytes(16);
  return hashPassword(DEMO_PASSWORD, salt);
}

async function insertMany<T extends PgTable>(tx: Tx, table: T, rows: Insert<T>[]): Promise<void> {
  for (let i = 0; i < rows.length; i += 400) {
    await tx.insert(table).values(rows.slice(i, i + 400));
  }
}

async function insertScenario(tx: Tx, sc: DemoScenario): Promise<void> {
  await tx.insert(schema.shopSettings).values(sc.settings);
  await insertMany(tx, schema.roastDays, sc.roastDays);
  await insertMany(tx, schema.users, sc.users);
  await insertMany(tx, schema.addresses, sc.addresses);
  await insertMany(tx, schema.lots, sc.lots);
  await insertMany(tx, schema.lotPriceBreaks, sc.priceBreaks);
  await insertMany(tx, schema.subscriptions, sc.subscriptions);
  // orders ↔ deliveries point at each other: insert orders first, then deliveries, then link back.
  await insertMany(tx, schema.orders, sc.orders);
  await insertMany(tx, schema.orderItems, sc.orderItems);
  await insertMany(tx, schema.deliveries, sc.deliveries);
  await tx.execute(sql`update ${schema.orders} set delivery_id = d.id from ${schema.deliveries} d where d.order_id = ${schema.orders.id}`);
  await insertMany(tx, schema.rotationPicks, sc.rotationPicks);
  await insertMany(tx, schema.batches, sc.batches);
  await insertMany(tx, schema.bagAllocations, sc.bagAllocations);
  await insertMany(tx, schema.stockMovements, sc.stockMovements);
  await insertMany(tx, schema.journalEntries, sc.journalEntries);
  await insertMany(tx, schema.emailOutbox, sc.outbox);
}

/** Used by tests: row counts per table that the seed fills. */
export const seededTables = {
  users: schema.users,
  addresses: schema.addresses,
  lots: schema.lots,
  lotPriceBreaks: schema.lotPriceBreaks,
  subscriptions: schema.subscriptions,
  deliveries: schema.deliveries,
  orders: schema.orders,
  orderItems: schema.orderItems,
  rotationPicks: schema.rotationPicks,
  batches: schema.batches,
  bagAllocations: schema.bagAllocations,
  stockMovements: schema.stockMovements,
  journalEntries: schema.journalEntries,
  emailOutbox: schema.emailOutbox,
  roastDays: schema.roastDays,
  shopSettings: schema.shopSettings,
} as const;
