import type { LotListQuery, LotSummary } from '@shared/schemas/lots';
import { startListener, type Listener } from '../../jobs/listener';
import type { Logger } from '../../lib/logger';

/** The channel the lots, lot_price_breaks and uploads triggers notify on (migration 0009). */
export const LOTS_CHANGED_CHANNEL = 'lots_changed';

/** How many distinct filter combinations are kept; the storefront asks for a handful. */
const maxEntries = 200;

/**
 * The public lot list held in memory. It changes only when staff edit a lot or stock moves, and
 * every such write notifies `lots_changed` (a trigger, so no write path can forget), so each process
 * drops what it holds on the notice. While the notice connection is down nothing is kept: a missed
 * notice could otherwise serve a stale list.
 */
export interface LotListCache {
  read(query: LotListQuery, load: () => Promise<LotSummary[]>): Promise<LotSummary[]>;
  stop(): Promise<void>;
}

export function startLotListCache(options: { databaseUrl: string; logger: Logger }): LotListCache {
  const entries = new Map<string, LotSummary[]>();
  let live = false;
  // Bumped on every change, so a read that began before a change never stores what it loaded.
  let generation = 0;
  const dropAll = () => {
    generation += 1;
    entries.clear();
  };
  const listener: Listener = startListener({
    databaseUrl: options.databaseUrl,
    logger: options.logger,
    channels: { [LOTS_CHANGED_CHANNEL]: dropAll },
    onReconnect: () => {
      dropAll();
      live = true;
    },
    onDisconnect: () => {
      live = false;
      dropAll();
    },
  });

  return {
    async read(query, load) {
      if (!live) return load();
      const key = JSON.stringify(Object.entries(query).sort(([a], [b]) => a.localeCompare(b)));
      const held = entries.get(key);
      if (held) return held;
      const startedAt = generation;
      const loaded = await load();
      if (live && startedAt === generation) {
        if (entries.size >= maxEntries) entries.delete(entries.keys().next().value!);
        entries.set(key, loaded);
      }
      return loaded;
    },
    async stop() {
      live = false;
      await listener.stop();
    },
  };
}
