import { homeRoastGuide, type HomeRoastGuide } from '@shared/domain/home-roast-guide';
import { defaultLossModel } from '@shared/domain/roast-loss';
import { bagFillGrams } from '@shared/domain/units';
import { greenBagSizes } from '@shared/domain/vocabulary';
import type { LotDetail, LotListQuery, LotSummary, RoastGuideQuery } from '@shared/schemas/lots';
import { AppError } from '../../lib/app-error';
import { lotDetailOf, uploadUrl } from './lot-detail';
import type { LotListCache } from './lot-list-cache';
import type { LotsRepo } from './lots.repo';

/** A lot is "in stock" while it can fill the smallest green bag sold. */
const smallestGreenBagGrams = Math.min(...greenBagSizes.map(bagFillGrams));

/** `listCache`: the in-memory list kept by a server process (API-only test apps read through to the database). */
export function createLotsService(repo: LotsRepo, listCache?: LotListCache) {
  async function loadList(query: LotListQuery): Promise<LotSummary[]> {
    const { inStock, ...filters } = query;
    const rows = await repo.listListed({ ...filters, ...(inStock ? { minStockGrams: smallestGreenBagGrams } : {}) });
    return rows.map(({ firstPhotoId, ...row }) => ({ ...row, photoUrl: firstPhotoId ? uploadUrl(firstPhotoId) : null }));
  }

  return {
    async list(query: LotListQuery): Promise<LotSummary[]> {
      return listCache ? listCache.read(query, () => loadList(query)) : loadList(query);
    },

    async get(code: string): Promise<LotDetail> {
      const found = await repo.findListedByCode(code);
      if (!found) throw new AppError(404, 'lot_not_found', `No lot with code ${code}.`);
      return lotDetailOf(found.lot, found.priceBreaks, found.files);
    },

    async roastGuide(code: string, query: RoastGuideQuery): Promise<HomeRoastGuide> {
      const [lot, lossModel] = await Promise.all([repo.findListedLevels(code), repo.lossModel()]);
      if (!lot) throw new AppError(404, 'lot_not_found', `No lot with code ${code}.`);
      return homeRoastGuide(
        { device: query.device, level: query.level ?? lot.suggestedLevel, greenGrams: query.greenGrams, suggestedLevel: lot.suggestedLevel },
        lossModel ?? defaultLossModel,
      );
    },
  };
}

export type LotsService = ReturnType<typeof createLotsService>;
