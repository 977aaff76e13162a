import { quoteSubscriptionDelivery, subscriptionBagPrices } from '@shared/domain/pricing';
import { greenNeededForRoasted } from '@shared/domain/roast-loss';
import { ScheduleError, scheduleOrder, subscriptionDeliveries, type RoastCalendar } from '@shared/domain/roast-schedule';
import { localDateOf } from '@shared/domain/shop-time';
import { bagFillGrams } from '@shared/domain/units';
import { roastLevelLabels, type CadenceWeeks } from '@shared/domain/vocabulary';
import { previewDeliveryCount, type SubscriptionPreview, type SubscriptionPreviewQuery } from '@shared/schemas/subscription-preview';
import type { ShopSettings } from '@shared/schemas/settings';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import type { SubscriptionPreviewRepo } from './subscription-preview.repo';
import { assertBagsShip } from '../shipping';

/** Green grams a roasted weight needs at a level, by the level's default loss and the shop's overage. */
function greenGramsFor(roastedGrams: number, level: keyof ShopSettings['lossModel'], settings: ShopSettings): number {
  return greenNeededForRoasted(roastedGrams, settings.lossModel[level].defaultPct, settings.overagePct);
}

export function createSubscriptionPreviewService({ repo, clock }: { repo: SubscriptionPreviewRepo; clock: Clock }) {
  /** The Roast Calendar from today on: closures and capacity overrides, and the green grams already planned each day. */
  async function calendarFrom(today: string, settings: ShopSettings): Promise<RoastCalendar> {
    const [overrides, plannedRows] = await Promise.all([repo.calendarOverrides(today), repo.plannedRoastedGrams(today)]);
    const plannedGreenGrams: Record<string, number> = {};
    for (const row of plannedRows) {
      plannedGreenGrams[row.roastDate] = (plannedGreenGrams[row.roastDate] ?? 0) + greenGramsFor(row.roastedGrams, row.roastLevel, settings);
    }
    return { overrides, plannedGreenGrams };
  }

  return {
    /**
     * The price of one delivery and the first deliveries if the choice were paid now: the first
     * roasts on the first open roast day whose cutoff has not passed with room for its green
     * coffee; the rest follow on the cadence's grid.
     */
    async preview(query: SubscriptionPreviewQuery): Promise<SubscriptionPreview> {
      const settings = await repo.shopSettings();
      if (query.lotCode) {
        const lot = await repo.findListedLot(query.lotCode);
        if (!lot) throw AppError.notFound('Lot');
        if (!lot.allowedLevels.includes(query.roastLevel)) {
          const allowed = lot.allowedLevels.map((level) => roastLevelLabels[level].toLowerCase()).join(', ');
          throw new AppError(422, 'roast_level_not_allowed', `${lot.name} is roasted ${allowed} only.`, {
            roastLevel: `Choose one of: ${allowed}.`,
          });
        }
      }
      const choice = { lotCode: query.lotCode, bagSize: query.bagSize, bagsPerDelivery: query.bagsPerDelivery };
      assertBagsShip([{ field: 'bagSize', size: query.bagSize }], settings.shipping);
      const quote = quoteSubscriptionDelivery(choice, settings);
      const regular = quoteSubscriptionDelivery(choice, { ...settings, subscriptionDiscountPct: 0 });

      const now = clock.now();
      const today = localDateOf(now, settings.timeZone);
      const calendar = await calendarFrom(today, settings);
      const coffee = { brewMethod: query.brewMethod, roastLevel: query.roastLevel };
      const greenGrams = greenGramsFor(bagFillGrams(query.bagSize) * query.bagsPerDelivery, query.roastLevel, settings);
      try {
        const first = scheduleOrder({ ...coffee, paidAt: now, greenGrams }, settings, calendar);
        const deliveries = subscriptionDeliveries(
          { ...coffee, anchorDate: first.roastDate, from: first.roastDate, cadenceWeeks: query.cadenceWeeks as CadenceWeeks, count: previewDeliveryCount, now },
          settings,
          calendar,
        );
        return {
          priceCents: quote.totalCents,
          regularPriceCents: regular.totalCents,
          discountPct: settings.subscriptionDiscountPct,
          shippingCents: quote.shippingCents,
          bagPriceCents: subscriptionBagPrices(settings),
          currency: settings.currency,
          shipPolicy: settings.shipPolicy,
          deliveries: deliveries.map(({ roastDate, shipDate, readyFrom, bestBefore, expectedArrival, cutoffAt }) => ({
            roastDate,
            shipDate,
            readyFrom,
            bestBefore,
            expectedArrival,
            cutoffAt,
          })),
        };
      } catch (error) {
        if (error instanceof ScheduleError) throw AppError.conflict(error.code, error.message);
        throw error;
      }
    },
  };
}

export type SubscriptionPreviewService = ReturnType<typeof createSubscriptionPreviewService>;
