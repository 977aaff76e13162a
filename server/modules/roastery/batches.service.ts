import { resolveExpectedLoss } from '@shared/domain/roast-loss';
import { batchMetrics, developmentTimeRatioPct } from '@shared/domain/roast-metrics';
import type { BatchCreate, BatchCreated, BatchListResponse } from '@shared/schemas/roastery';
import { AppError } from '../../lib/app-error';
import type { BatchesRepo } from './batches.repo';

export function createBatchesService(repo: BatchesRepo) {
  return {
    /**
     * Records a batch for the signed-in operator: loss and development time ratio from the trade
     * engine, a flag when the loss is outside the level's range, and the green taken from stock.
     */
    async record(input: BatchCreate, operatorId: string): Promise<BatchCreated> {
      const [{ settings }, lotId] = await Promise.all([repo.shopSettings(), repo.lotIdOf(input.lotCode)]);
      const metrics = batchMetrics(input, settings.lossModel);
      if (!metrics.ok) throw AppError.badRequest('Some fields are not valid.', metrics.fields);
      if (!lotId) throw new AppError(404, 'lot_not_found', `No lot with code ${input.lotCode}.`, { lotCode: 'is not a lot' });
      const recorded = await repo.record({
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
      if (recorded === 'short') {
        throw new AppError(409, 'stock_below_zero', `Lot ${input.lotCode} does not hold ${input.greenGramsIn.toLocaleString('en-US')} g of green; record an arrival or a count first.`, {
          greenGramsIn: 'is more than the lot has in stock',
        });
      }
      const planned = resolveExpectedLoss(input.roastLevel, settings.lossModel, recorded.history, settings.lossModelMinBatches);
      const range = settings.lossModel[input.roastLevel];
      return {
        id: recorded.id,
        lossPct: metrics.value.lossPct,
        withinExpected: metrics.value.withinExpected,
        lossPosition: metrics.value.lossPosition,
        expectedLossPct: { min: range.minPct, max: range.maxPct },
        ...(metrics.value.developmentSeconds !== undefined ? { developmentSeconds: metrics.value.developmentSeconds } : {}),
        ...(metrics.value.developmentTimeRatio !== undefined ? { developmentTimeRatio: metrics.value.developmentTimeRatio } : {}),
        lossSource: planned.source,
        plannedLossPct: planned.lossPct,
        stockGrams: recorded.stockGrams,
      };
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
