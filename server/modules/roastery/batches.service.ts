import { resolveExpectedLoss } from '@shared/domain/roast-loss';
import { batchMetrics, developmentTimeRatioPct } from '@shared/domain/roast-metrics';
import type { BatchCreate, BatchCreated, BatchListResponse } from '@shared/schemas/roastery';
import type { ShopSettings } from '@shared/schemas/settings';
import { AppError } from '../../lib/app-error';
import type { BatchesRepo, RecordedBatch } from './batches.repo';

type Metrics = Extract<ReturnType<typeof batchMetrics>, { ok: true }>['value'];
type Recorded = Pick<RecordedBatch, 'id' | 'stockGrams' | 'history'>;

function createdReply(input: BatchCreate, metrics: Metrics, recorded: Recorded, settings: ShopSettings): BatchCreated {
  const planned = resolveExpectedLoss(input.roastLevel, settings.lossModel, recorded.history, settings.lossModelMinBatches);
  const range = settings.lossModel[input.roastLevel];
  return {
    id: recorded.id,
    lossPct: metrics.lossPct,
    withinExpected: metrics.withinExpected,
    lossPosition: metrics.lossPosition,
    expectedLossPct: { min: range.minPct, max: range.maxPct },
    ...(metrics.developmentSeconds !== undefined ? { developmentSeconds: metrics.developmentSeconds } : {}),
    ...(metrics.developmentTimeRatio !== undefined ? { developmentTimeRatio: metrics.developmentTimeRatio } : {}),
    lossSource: planned.source,
    plannedLossPct: planned.lossPct,
    stockGrams: recorded.stockGrams,
  };
}

export function createBatchesService(repo: BatchesRepo) {
  /** The answer for a batch id already recorded: the same batch again, or 409 when the request describes another batch. */
  async function replay(id: string, input: BatchCreate, metrics: Metrics, settings: ShopSettings): Promise<BatchCreated | undefined> {
    const found = await repo.find(id);
    if (!found) return undefined;
    const { batch } = found;
    const same =
      found.lotCode === input.lotCode &&
      batch.roastDate === input.roastDate &&
      batch.roastLevel === input.roastLevel &&
      batch.greenGramsIn === input.greenGramsIn &&
      batch.roastedGramsOut === input.roastedGramsOut &&
      batch.totalSeconds === (input.totalSeconds ?? null) &&
      batch.firstCrackSeconds === (input.firstCrackSeconds ?? null);
    if (!same) throw new AppError(409, 'batch_id_taken', 'Another batch was already recorded with this id.', { id: 'belongs to another batch' });
    return createdReply(input, metrics, { id, stockGrams: found.stockGrams, history: found.history }, settings);
  }

  return {
    /**
     * Records a batch for the signed-in operator: loss and development time ratio from the trade
     * engine, a flag when the loss is outside the level's range, and the green taken from stock.
     * A request repeated with the same id records nothing more and answers as the first did.
     */
    async record(input: BatchCreate, operatorId: string): Promise<BatchCreated> {
      const [{ settings }, lotId] = await Promise.all([repo.shopSettings(), repo.lotIdOf(input.lotCode)]);
      const metrics = batchMetrics(input, settings.lossModel);
      if (!metrics.ok) throw AppError.badRequest('Some fields are not valid.', metrics.fields);
      if (!lotId) throw new AppError(404, 'lot_not_found', `No lot with code ${input.lotCode}.`, { lotCode: 'is not a lot' });
      if (input.id) {
        const earlier = await replay(input.id, input, metrics.value, settings);
        if (earlier) return earlier;
      }
      const recorded = await repo.record({
        ...(input.id ? { id: input.id } : {}),
        roastDate: input.roastDate,
        lotId,
        roastLevel: input.roastLevel,
        greenGramsIn: input.greenGramsIn,
        roastedGramsOut: input.roastedGramsOut,
        totalSeconds: input.totalSeconds ?? null,
        firstCrackSeconds: input.firstCrackSeconds ?? null,
        lossPct: metrics.value.lossPct,
        withinExpected: metrics.value.withinExpected,
        notes: input.notes ?? '',
        operatorId,
      });
      if (recorded === 'duplicate' || (recorded === 'short' && input.id)) {
        // Lost a race with the same request: the other one recorded it (and may have taken the last green).
        const earlier = await replay(input.id!, input, metrics.value, settings);
        if (earlier) return earlier;
        if (recorded === 'duplicate') throw new Error(`batch ${input.id} was a duplicate and then could not be found`);
      }
      if (recorded === 'short') {
        throw new AppError(
          409,
          'stock_below_zero',
          `Lot ${input.lotCode} does not hold ${input.greenGramsIn.toLocaleString('en-US')} g of green; record an arrival or a count first.`,
          {
            greenGramsIn: 'is more than the lot has in stock',
          },
        );
      }
      return createdReply(input, metrics.value, recorded, settings);
    },

    async onDay(roastDate: string): Promise<BatchListResponse> {
      const rows = await repo.onDay(roastDate);
      return {
        items: rows.map((row) => ({
          ...row,
          developmentTimeRatio:
            row.firstCrackSeconds !== null && row.totalSeconds !== null ? developmentTimeRatioPct(row.firstCrackSeconds, row.totalSeconds) : null,
          createdAt: row.createdAt.toISOString(),
        })),
      };
    },
  };
}

export type BatchesService = ReturnType<typeof createBatchesService>;
