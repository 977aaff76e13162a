import { stringify } from 'csv-stringify/sync';
import { compareWithGuide, summarizeLotRoasts, JOURNAL_SUMMARY_MINIMUM } from '@shared/domain/journal';
import { developmentTimeRatioPct, journalMetrics } from '@shared/domain/roast-metrics';
import { localDateOf } from '@shared/domain/shop-time';
import type { RoastLevel } from '@shared/domain/vocabulary';
import type { JournalEntry, JournalEntryCreated, JournalEntryInput, JournalListQuery, JournalListResponse } from '@shared/schemas/journal';
import type { LotRoastSummaryResponse } from '@shared/schemas/journal-summary';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import type { JournalRepo, StoredEntry } from './journal.repo';

const noSuchEntry = () => AppError.notFound('That journal entry');
const noSuchLot = (code: string) => new AppError(404, 'lot_not_found', `No lot with code ${code}.`, { lotCode: 'is not a lot' });
const orUndefined = <T>(value: T | null): T | undefined => (value === null ? undefined : value);

type ListedRow = Awaited<ReturnType<JournalRepo['list']>>[number];

function entryOf(row: ListedRow): JournalEntry {
  const developmentSeconds = orUndefined(row.developmentSeconds);
  const ratio = row.firstCrackSeconds !== null ? developmentTimeRatioPct(row.firstCrackSeconds, row.endSeconds) : undefined;
  return {
    id: row.id,
    lotCode: row.lotCode,
    lotName: row.lotName,
    device: row.device,
    roastedOn: row.roastedOn,
    greenGrams: row.greenGrams,
    roastedGrams: row.roastedGrams,
    ...(row.yellowSeconds !== null ? { yellowSeconds: row.yellowSeconds } : {}),
    ...(row.firstCrackSeconds !== null ? { firstCrackSeconds: row.firstCrackSeconds } : {}),
    endSeconds: row.endSeconds,
    ...(row.levelReached !== null ? { levelReached: row.levelReached } : {}),
    notes: row.notes,
    createdAt: row.createdAt.toISOString(),
    lossPct: row.lossPct,
    ...(developmentSeconds !== undefined ? { developmentSeconds } : {}),
    ...(ratio !== undefined ? { developmentTimeRatio: ratio } : {}),
    estimatedLevel: row.estimatedLevel,
    comparison: compareWithGuide(
      { device: row.device, developmentSeconds, levelReached: orUndefined(row.levelReached), estimatedLevel: row.estimatedLevel },
      row.suggestedLevel,
    ),
  };
}

export const journalCsvColumns = [
  'roasted_on',
  'lot_code',
  'lot_name',
  'device',
  'green_grams',
  'roasted_grams',
  'yellow_seconds',
  'first_crack_seconds',
  'end_seconds',
  'loss_pct',
  'development_seconds',
  'development_time_ratio_pct',
  'level_reached',
  'estimated_level',
  'notes',
] as const;

export function createJournalService(repo: JournalRepo, clock: Clock) {
  /** The row to store and the answer to give, from the trade engine; 400 naming the fields for an impossible roast. */
  async function worked(input: JournalEntryInput): Promise<{ stored: StoredEntry; created: Omit<JournalEntryCreated, 'id'> }> {
    const [lot, { settings }] = await Promise.all([repo.lotByCode(input.lotCode), repo.shopSettings()]);
    const metrics = journalMetrics(input, settings.lossModel, lot?.suggestedLevel);
    if (!metrics.ok) throw AppError.badRequest('Some fields are not valid.', metrics.fields);
    if (!lot) throw noSuchLot(input.lotCode);
    const { lossPct, developmentSeconds, developmentTimeRatio, estimatedLevel } = metrics.value;
    const comparison = compareWithGuide({ device: input.device, developmentSeconds, levelReached: input.levelReached, estimatedLevel }, lot.suggestedLevel);
    return {
      stored: {
        lotId: lot.id,
        device: input.device,
        roastedOn: input.roastedOn ?? localDateOf(clock.now(), settings.timeZone),
        greenGrams: input.greenGrams,
        roastedGrams: input.roastedGrams,
        yellowSeconds: input.yellowSeconds ?? null,
        firstCrackSeconds: input.firstCrackSeconds ?? null,
        endSeconds: input.endSeconds,
        levelReached: input.levelReached ?? null,
        estimatedLevel,
        lossPct,
        developmentSeconds: developmentSeconds ?? null,
        notes: input.notes ?? '',
      },
      created: {
        lossPct,
        ...(developmentSeconds !== undefined ? { developmentSeconds } : {}),
        ...(developmentTimeRatio !== undefined ? { developmentTimeRatio } : {}),
        estimatedLevel,
        comparison,
      },
    };
  }

  async function summaryOf(code: string): Promise<LotRoastSummaryResponse> {
    const lot = await repo.lotByCode(code);
    if (!lot) throw noSuchLot(code);
    const roasts = (await repo.roastsOfLot(lot.id)).map((roast) => ({
      customerId: roast.customerId,
      lossPct: roast.lossPct,
      developmentSeconds: orUndefined(roast.developmentSeconds),
      levelReached: orUndefined<RoastLevel>(roast.levelReached),
      estimatedLevel: roast.estimatedLevel,
    }));
    return { lotCode: lot.code, suggestedLevel: lot.suggestedLevel, minimum: JOURNAL_SUMMARY_MINIMUM, summary: summarizeLotRoasts(roasts, lot.suggestedLevel) };
  }

  async function list(userId: string, query: JournalListQuery): Promise<JournalEntry[]> {
    let lotId: string | undefined;
    if (query.lotCode) {
      const lot = await repo.lotByCode(query.lotCode);
      if (!lot) return [];
      lotId = lot.id;
    }
    return (await repo.list(userId, { lotId, device: query.device })).map(entryOf);
  }

  return {
    async list(userId: string, query: JournalListQuery): Promise<JournalListResponse> {
      const [items, lots] = await Promise.all([list(userId, query), repo.lotsFor(userId)]);
      return { items, lots };
    },

    /** The customer's journal as CSV, every entry, newest first. */
    async csv(userId: string): Promise<string> {
      const rows = (await list(userId, {})).map((entry) => ({
        roasted_on: entry.roastedOn,
        lot_code: entry.lotCode,
        lot_name: entry.lotName,
        device: entry.device,
        green_grams: entry.greenGrams,
        roasted_grams: entry.roastedGrams,
        yellow_seconds: entry.yellowSeconds ?? '',
        first_crack_seconds: entry.firstCrackSeconds ?? '',
        end_seconds: entry.endSeconds,
        loss_pct: entry.lossPct,
        development_seconds: entry.developmentSeconds ?? '',
        development_time_ratio_pct: entry.developmentTimeRatio ?? '',
        level_reached: entry.levelReached ?? '',
        estimated_level: entry.estimatedLevel,
        notes: entry.notes,
      }));
      return stringify(rows, { header: true, columns: [...journalCsvColumns] });
    },

    async create(userId: string, input: JournalEntryInput): Promise<JournalEntryCreated> {
      const { stored, created } = await worked(input);
      return { id: await repo.insert(userId, stored), ...created };
    },

    async update(userId: string, id: string, input: JournalEntryInput): Promise<JournalEntryCreated> {
      const { stored, created } = await worked(input);
      if (!(await repo.update(userId, id, stored))) throw noSuchEntry();
      return { id, ...created };
    },

    async remove(userId: string, id: string): Promise<void> {
      if (!(await repo.remove(userId, id))) throw noSuchEntry();
    },

    summary: summaryOf,
  };
}

export type JournalService = ReturnType<typeof createJournalService>;
