import { eq, sql } from 'drizzle-orm';
import { afterAll, describe, expect, inject, it } from 'vitest';
import type { LotSummary } from '@shared/schemas/lots';
import { lots } from '../../server/db/schema/index';
import { createLogger } from '../../server/lib/logger';
import { startLotListCache } from '../../server/modules/lots/lot-list-cache';
import { waitFor } from '../api/outbox-support';
import { createLotForSale } from '../factories/index';
import { getTestDb } from '../setup/test-db';

const logger = createLogger({ LOG_LEVEL: 'silent', NODE_ENV: 'test' });
// Two caches stand for two server processes: each has its own LISTEN connection.
const caches = [startLotListCache({ databaseUrl: inject('databaseUrl'), logger }), startLotListCache({ databaseUrl: inject('databaseUrl'), logger })];
afterAll(async () => {
  for (const cache of caches) await cache.stop();
});

/** A loader that counts its calls, as the database query behind the list would be. */
function countingLoader() {
  const loader = { calls: 0, load: async (): Promise<LotSummary[]> => ((loader.calls += 1), []) };
  return loader;
}

/** Reads until a second read is answered from memory (the cache is live once its LISTEN is up). */
async function readUntilHeld(cache: (typeof caches)[number], loader: ReturnType<typeof countingLoader>, query = {}) {
  await waitFor(
    async () => {
      await cache.read(query, loader.load);
      const before = loader.calls;
      await cache.read(query, loader.load);
      return loader.calls - before;
    },
    (newLoads) => newLoads === 0,
    10_000,
    'the list to be held in memory',
  );
}

describe('the lot list kept in memory', () => {
  it('answers repeated reads from memory, per filter combination, and every process drops it when a lot or its stock changes', async () => {
    const lot = await createLotForSale(5000);
    const loaders = caches.map(() => countingLoader());
    await Promise.all(caches.map((cache, index) => readUntilHeld(cache, loaders[index]!)));
    const heldLoads = loaders.map((loader) => loader.calls);
    const filtered = countingLoader();
    await caches[0]!.read({ origin: 'Testland' }, filtered.load);
    expect(filtered.calls).toBe(1);

    // Stock moves in another connection (as a checkout in another process would).
    await getTestDb()
      .update(lots)
      .set({ stockGrams: sql`${lots.stockGrams} - 454` })
      .where(eq(lots.id, lot.id));

    for (const [index, cache] of caches.entries()) {
      const loader = loaders[index]!;
      await waitFor(
        async () => (await cache.read({}, loader.load), loader.calls),
        (calls) => calls > heldLoads[index]!,
        10_000,
        `process ${index + 1} to drop its list`,
      );
    }
    await caches[0]!.read({ origin: 'Testland' }, filtered.load);
    expect(filtered.calls).toBe(2);
  });

  it('a read that began before a change does not keep what it loaded', async () => {
    const cache = caches[0]!;
    const lot = await createLotForSale(5000);
    const warm = countingLoader();
    await readUntilHeld(cache, warm, { q: 'warm-up' });
    let releaseLoad!: () => void;
    const slow = { calls: 0, load: () => new Promise<LotSummary[]>((resolve) => ((slow.calls += 1), (releaseLoad = () => resolve([])))) };
    const reading = cache.read({ q: 'race' }, slow.load);
    await waitFor(
      async () => slow.calls,
      (calls) => calls === 1,
      5000,
      'the slow read to start',
    );
    await getTestDb().update(lots).set({ stockGrams: 1 }).where(eq(lots.id, lot.id));
    // The change's notice arrives while the slow read is still loading: the warm entry is dropped.
    await waitFor(
      async () => (await cache.read({ q: 'warm-up' }, warm.load), warm.calls),
      (calls) => calls >= 2,
      10_000,
      'the notice',
    );
    releaseLoad();
    await reading;

    const after = countingLoader();
    await cache.read({ q: 'race' }, after.load);
    expect(after.calls).toBe(1);
  });
});
