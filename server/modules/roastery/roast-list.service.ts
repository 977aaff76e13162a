import { buildRoastList, type RoastOrderLine } from '@shared/domain/roast-list';
import type { LotLossRecord } from '@shared/domain/roast-loss';
import { dayCapacityGrams, isOpenRoastDay, type CalendarOverride } from '@shared/domain/roast-schedule';
import { roastLevelLabels, roastersRotationName, type RoastLevel } from '@shared/domain/vocabulary';
import type { RoastListResponse, RoastListWarning } from '@shared/schemas/roastery';
import type { ShopSettings } from '@shared/schemas/settings';
import type { RoastDayGroup, RoastListRepo } from './roast-list.repo';

const plural = (count: number, one: string, many: string) => `${count.toLocaleString('en-US')} ${count === 1 ? one : many}`;

/**
 * The Roast List of one day from its summed order groups (RoastListRepo.dayGroups): the trade
 * engine's list with lot names, what is already recorded, and the day's own warnings.
 */
export function roastListFromGroups(
  date: string,
  groups: readonly RoastDayGroup[],
  settings: ShopSettings,
  override: CalendarOverride | undefined,
): RoastListResponse {
  const calendar = override ? { overrides: { [date]: override } } : {};
  const open = isOpenRoastDay(date, settings, calendar);
  const capacityGrams = dayCapacityGrams(date, settings, calendar);

  const lines: RoastOrderLine[] = [];
  const stockGrams: Record<string, number> = {};
  const lotLoss: Record<string, Partial<Record<RoastLevel, LotLossRecord>>> = {};
  const lotNames = new Map<string, string>();
  const recorded = new Map<string, { batches: number; greenGrams: number; roastedGrams: number }>();
  const covered: Record<string, Partial<Record<RoastLevel, number>>> = {};
  const unpicked = new Map<RoastLevel, number>();
  let bagsToRoast = 0;
  for (const group of groups) {
    bagsToRoast += group.bags - group.doneBags;
    if (group.lotCode === null) {
      if (group.bags > group.doneBags) unpicked.set(group.roastLevel, (unpicked.get(group.roastLevel) ?? 0) + group.bags - group.doneBags);
      continue;
    }
    const { lotCode, roastLevel } = group;
    lines.push({ lotCode, roastLevel, fillGrams: group.fillGrams, quantity: group.bags });
    stockGrams[lotCode] = group.stockGrams;
    lotNames.set(lotCode, group.lotName ?? lotCode);
    (lotLoss[lotCode] ??= {})[roastLevel] = {
      batchCount: group.historyBatches,
      greenGramsIn: group.historyGreenGrams,
      roastedGramsOut: group.historyRoastedGrams,
    };
    recorded.set(`${lotCode} ${roastLevel}`, { batches: group.dayBatches, greenGrams: group.dayGreenGrams, roastedGrams: group.dayRoastedGrams });
    // Done bags need no roasting; the day's roast no bag has taken yet covers bags still to pack.
    // A lot and level come as one group per fill weight, each carrying the same batch figures.
    const lotCovered = (covered[lotCode] ??= {});
    const unallocated = lotCovered[roastLevel] === undefined ? Math.max(0, group.dayRoastedGrams - group.dayAllocatedGrams) : 0;
    lotCovered[roastLevel] = (lotCovered[roastLevel] ?? 0) + unallocated + group.doneBags * group.fillGrams;
  }

  const list = buildRoastList({
    date,
    lines,
    settings,
    lotLoss,
    stockGrams,
    coveredRoastedGrams: covered,
    // A closed day gets its own warning; measuring it against no capacity would only repeat it.
    dayCapacityGrams: open ? capacityGrams : settings.dayCapacityGrams,
  });

  const warnings: RoastListWarning[] = [];
  if (!open && bagsToRoast > 0) {
    warnings.push({ code: 'day_closed', message: `${date} is closed on the Roast Calendar but still has orders to roast.` });
  }
  for (const [roastLevel, bags] of unpicked) {
    warnings.push({
      code: 'rotation_not_picked',
      roastLevel,
      message: `${plural(bags, 'bag', 'bags')} of ${roastersRotationName} at ${roastLevelLabels[roastLevel].toLowerCase()} have no lot picked for this day, so they are not on the list.`,
    });
  }
  warnings.push(...list.warnings);

  return {
    date,
    day: { open, capacityGrams },
    lines: list.lines.map((line) => ({
      ...line,
      lotName: lotNames.get(line.lotCode) ?? line.lotCode,
      recorded: recorded.get(`${line.lotCode} ${line.roastLevel}`) ?? { batches: 0, greenGrams: 0, roastedGrams: 0 },
    })),
    pull: list.pull.map((pull) => ({ ...pull, lotName: lotNames.get(pull.lotCode) ?? pull.lotCode })),
    totals: list.totals,
    warnings,
  };
}

export function createRoastListService(repo: RoastListRepo) {
  return {
    async roastList(date: string): Promise<{ shopName: string; list: RoastListResponse }> {
      const [groups, override, { shopName, settings }] = await Promise.all([repo.dayGroups(date), repo.dayOverride(date), repo.shopSettings()]);
      return { shopName, list: roastListFromGroups(date, groups, settings, override) };
    },
  };
}

export type RoastListService = ReturnType<typeof createRoastListService>;
