import { and, asc, desc, eq, gte, ilike, lte, or, sql, type SQL } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { lotPriceBreaks, lots, shopSettings, uploads } from '../../db/schema/index';
import type { LotListQuery, LotSort } from '@shared/schemas/lots';

/** The query's filters, with "in stock" already turned into a gram threshold by the service. */
export type LotFilters = Omit<LotListQuery, 'inStock'> & { minStockGrams?: number };

/** Each sort ends on the code, so lots that tie keep one order from page to page. */
const lotOrderings: Record<LotSort, SQL[]> = {
  origin: [asc(lots.origin), asc(lots.name), asc(lots.code)],
  name: [asc(lots.name), asc(lots.code)],
  'price-asc': [asc(lots.pricePerKgCents), asc(lots.name), asc(lots.code)],
  'price-desc': [desc(lots.pricePerKgCents), asc(lots.name), asc(lots.code)],
  newest: [desc(lots.cropYear), desc(lots.createdAt), asc(lots.code)],
  altitude: [desc(lots.altitudeM), asc(lots.name), asc(lots.code)],
};

function escapeLike(text: string) {
  return text.replace(/[\\%_]/g, (character) => `\\${character}`);
}

/** A letter per filter a list request may use. */
const filterLetters = {
  q: 'q',
  origin: 'o',
  process: 'p',
  level: 'l',
  minStockGrams: 's',
  minPricePerKgCents: 'a',
  maxPricePerKgCents: 'b',
} as const satisfies Record<keyof Omit<LotFilters, 'sort'>, string>;

/**
 * The statement name for the filters a request uses and its sort, e.g. `lots_list_ps_price-asc`:
 * the same shape always has the same SQL, so any repo on any pool can share the name.
 */
function statementNameFor(filters: LotFilters): string {
  const letters = (Object.keys(filterLetters) as (keyof typeof filterLetters)[])
    .filter((key) => filters[key] !== undefined && filters[key] !== '')
    .map((key) => filterLetters[key])
    .join('');
  return `lots_list_${letters || 'all'}_${filters.sort ?? 'origin'}`;
}

// Each card's first photo comes in the same query, so the list is one round trip. Written out in
// full: drizzle leaves columns unqualified in a one-table select, which would turn the correlation
// into uploads.lot_id = uploads.id.
const firstPhotoId = sql<string | null>`(
  select u.id from uploads u
  where u.lot_id = lots.id and u.kind = 'photo'
  order by u.position, u.created_at
  limit 1)`;

function prepareListListed(db: Db, filters: LotFilters, name: string) {
  const conditions: SQL[] = [eq(lots.isListed, true)];
  if (filters.q) {
    const pattern = sql.placeholder('pattern');
    conditions.push(
      or(
        ilike(lots.name, pattern),
        ilike(lots.origin, pattern),
        ilike(lots.region, pattern),
        ilike(lots.producer, pattern),
        ilike(lots.variety, pattern),
        ilike(lots.code, pattern),
        sql`array_to_string(${lots.tastingNotes}, ' ') ilike ${pattern}`,
      )!,
    );
  }
  if (filters.origin) conditions.push(sql`lower(${lots.origin}) = lower(${sql.placeholder('origin')})`);
  if (filters.process) conditions.push(eq(lots.process, sql.placeholder('process')));
  if (filters.level) conditions.push(eq(lots.suggestedLevel, sql.placeholder('level')));
  if (filters.minStockGrams !== undefined) conditions.push(gte(lots.stockGrams, sql.placeholder('minStockGrams')));
  if (filters.minPricePerKgCents !== undefined) conditions.push(gte(lots.pricePerKgCents, sql.placeholder('minPricePerKgCents')));
  if (filters.maxPricePerKgCents !== undefined) conditions.push(lte(lots.pricePerKgCents, sql.placeholder('maxPricePerKgCents')));
  return db
    .select({
      code: lots.code,
      name: lots.name,
      origin: lots.origin,
      region: lots.region,
      process: lots.process,
      variety: lots.variety,
      altitudeM: lots.altitudeM,
      cropYear: lots.cropYear,
      suggestedLevel: lots.suggestedLevel,
      tastingNotes: lots.tastingNotes,
      cuppingScore: lots.cuppingScore,
      stockGrams: lots.stockGrams,
      pricePerKgCents: lots.pricePerKgCents,
      firstPhotoId,
    })
    .from(lots)
    .where(and(...conditions))
    .orderBy(...lotOrderings[filters.sort ?? 'origin'])
    .prepare(name);
}

type ListListedStatement = ReturnType<typeof prepareListListed>;

export function createLotsRepo(db: Db) {
  // The catalog is the busiest read: a named statement per filter shape is parsed and planned by
  // PostgreSQL once per connection instead of on every request (a few dozen shapes at most).
  const listStatements = new Map<string, ListListedStatement>();

  return {
    async listListed(filters: LotFilters) {
      const name = statementNameFor(filters);
      let statement = listStatements.get(name);
      if (!statement) {
        statement = prepareListListed(db, filters, name);
        listStatements.set(name, statement);
      }
      return statement.execute({
        pattern: filters.q ? `%${escapeLike(filters.q)}%` : undefined,
        origin: filters.origin,
        process: filters.process,
        level: filters.level,
        minStockGrams: filters.minStockGrams,
        minPricePerKgCents: filters.minPricePerKgCents,
        maxPricePerKgCents: filters.maxPricePerKgCents,
      });
    },

    async findListedByCode(code: string) {
      const lot = await db.query.lots.findFirst({ where: and(eq(lots.code, code), eq(lots.isListed, true)) });
      if (!lot) return undefined;
      const [priceBreaks, files] = await Promise.all([
        db
          .select({ minGrams: lotPriceBreaks.minGrams, pricePerKgCents: lotPriceBreaks.pricePerKgCents })
          .from(lotPriceBreaks)
          .where(eq(lotPriceBreaks.lotId, lot.id))
          .orderBy(asc(lotPriceBreaks.minGrams)),
        db.select({ id: uploads.id, kind: uploads.kind }).from(uploads).where(eq(uploads.lotId, lot.id)).orderBy(asc(uploads.position), asc(uploads.createdAt)),
      ]);
      return { lot, priceBreaks, files };
    },

    /** The owner's loss model, or undefined before the shop has settings. */
    async lossModel() {
      const [settings] = await db.select({ lossModel: shopSettings.lossModel }).from(shopSettings).limit(1);
      return settings?.lossModel;
    },

    async findListedLevels(code: string) {
      const [lot] = await db
        .select({ suggestedLevel: lots.suggestedLevel, allowedLevels: lots.allowedLevels })
        .from(lots)
        .where(and(eq(lots.code, code), eq(lots.isListed, true)));
      return lot;
    },
  };
}

export type LotsRepo = ReturnType<typeof createLotsRepo>;
