import { sql } from 'drizzle-orm';
import type { AnyPgColumn } from 'drizzle-orm/pg-core';
import { boolean, check, index, integer, numeric, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { users } from './accounts';
import { instant, timestamps } from './common';
import { processEnum, roastLevelEnum, stockMovementReasonEnum, uploadKindEnum } from './enums';
import { orders } from './orders';
import { batches } from './roastery';

/** A green coffee lot: what the shop buys from an importer and sells by weight (stock in grams). */
export const lots = pgTable(
  'lots',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    /** Shop's lot code, e.g. WR-24-ETH-01; used in URLs and on bag labels. */
    code: text('code').notNull(),
    name: text('name').notNull(),
    origin: text('origin').notNull(),
    region: text('region').notNull(),
    producer: text('producer').notNull(),
    variety: text('variety').notNull(),
    process: processEnum('process').notNull(),
    altitudeM: integer('altitude_m').notNull(),
    cropYear: integer('crop_year').notNull(),
    moisturePct: numeric('moisture_pct', { precision: 4, scale: 2, mode: 'number' }).notNull(),
    densityGPerL: integer('density_g_per_l'),
    /** Screen size as the importer writes it, e.g. "16/18" (n/64 in). */
    screenSize: text('screen_size'),
    cuppingScore: numeric('cupping_score', { precision: 5, scale: 2, mode: 'number' }),
    tastingNotes: text('tasting_notes')
      .array()
      .notNull()
      .default(sql`'{}'::text[]`),
    description: text('description').notNull().default(''),
    suggestedLevel: roastLevelEnum('suggested_level').notNull(),
    allowedLevels: roastLevelEnum('allowed_levels').array().notNull(),
    stockGrams: integer('stock_grams').notNull().default(0),
    /** Staff want to reorder once stock falls to this many grams (0: no alert). */
    reorderPointGrams: integer('reorder_point_grams').notNull().default(0),
    /** Days from ordering more of this lot from the supplier to having it on the shelf (green planning's reorder-by day); two weeks until staff set it (common practice). */
    supplierLeadTimeDays: integer('supplier_lead_time_days').notNull().default(14),
    pricePerKgCents: integer('price_per_kg_cents').notNull(),
    isListed: boolean('is_listed').notNull().default(true),
    ...timestamps(),
  },
  (t) => [
    uniqueIndex('lots_code_key').on(t.code),
    index('lots_origin_idx').on(t.origin),
    index('lots_process_idx').on(t.process),
    index('lots_suggested_level_idx').on(t.suggestedLevel),
    check('lots_code_not_blank', sql`length(trim(${t.code})) > 0`),
    check('lots_stock_grams_non_negative', sql`${t.stockGrams} >= 0`),
    check('lots_reorder_point_non_negative', sql`${t.reorderPointGrams} >= 0`),
    check('lots_supplier_lead_time_range', sql`${t.supplierLeadTimeDays} between 0 and 365`),
    check('lots_price_per_kg_positive', sql`${t.pricePerKgCents} > 0`),
    check('lots_moisture_range', sql`${t.moisturePct} >= 0 and ${t.moisturePct} <= 20`),
    check('lots_cupping_score_range', sql`${t.cuppingScore} is null or (${t.cuppingScore} >= 0 and ${t.cuppingScore} <= 100)`),
    check('lots_altitude_range', sql`${t.altitudeM} >= 0 and ${t.altitudeM} <= 3500`),
    check('lots_crop_year_range', sql`${t.cropYear} between 1990 and 2100`),
    check('lots_density_positive', sql`${t.densityGPerL} is null or ${t.densityGPerL} > 0`),
    check('lots_allowed_levels_not_empty', sql`cardinality(${t.allowedLevels}) > 0`),
    check('lots_suggested_level_allowed', sql`${t.suggestedLevel} = any(${t.allowedLevels})`),
  ],
);

/** Quantity breaks: a line of at least minGrams of this lot is priced at pricePerKgCents. */
export const lotPriceBreaks = pgTable(
  'lot_price_breaks',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    lotId: uuid('lot_id')
      .notNull()
      .references(() => lots.id, { onDelete: 'cascade' }),
    minGrams: integer('min_grams').notNull(),
    pricePerKgCents: integer('price_per_kg_cents').notNull(),
  },
  (t) => [
    uniqueIndex('lot_price_breaks_lot_id_min_grams_key').on(t.lotId, t.minGrams),
    check('lot_price_breaks_min_grams_positive', sql`${t.minGrams} > 0`),
    check('lot_price_breaks_price_positive', sql`${t.pricePerKgCents} > 0`),
  ],
);

/** Files uploaded by staff: lot photos and spec sheets (bytes live in storage under storageKey). */
export const uploads = pgTable(
  'uploads',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    lotId: uuid('lot_id').references(() => lots.id, { onDelete: 'cascade' }),
    kind: uploadKindEnum('kind').notNull(),
    storageKey: text('storage_key').notNull(),
    contentType: text('content_type').notNull(),
    byteSize: integer('byte_size').notNull(),
    originalName: text('original_name').notNull(),
    /** Display order among a lot's photos (0 first). */
    position: integer('position').notNull().default(0),
    uploadedBy: uuid('uploaded_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: instant('created_at').notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex('uploads_storage_key_key').on(t.storageKey),
    index('uploads_lot_id_kind_position_idx').on(t.lotId, t.kind, t.position),
    check('uploads_byte_size_positive', sql`${t.byteSize} > 0`),
    check('uploads_position_non_negative', sql`${t.position} >= 0`),
  ],
);

/**
 * Every change to a lot's green stock, signed (negative = out). The lot's stockGrams is the running
 * total; the sum of a lot's movements equals its stockGrams.
 */
export const stockMovements = pgTable(
  'stock_movements',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    lotId: uuid('lot_id')
      .notNull()
      .references(() => lots.id, { onDelete: 'cascade' }),
    deltaGrams: integer('delta_grams').notNull(),
    reason: stockMovementReasonEnum('reason').notNull(),
    note: text('note').notNull().default(''),
    orderId: uuid('order_id').references((): AnyPgColumn => orders.id, { onDelete: 'set null' }),
    batchId: uuid('batch_id').references((): AnyPgColumn => batches.id, { onDelete: 'set null' }),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: instant('created_at').notNull().defaultNow(),
  },
  (t) => [
    index('stock_movements_lot_id_created_at_idx').on(t.lotId, t.createdAt),
    index('stock_movements_order_id_idx').on(t.orderId),
    index('stock_movements_batch_id_idx').on(t.batchId),
    check('stock_movements_delta_non_zero', sql`${t.deltaGrams} <> 0`),
  ],
);
