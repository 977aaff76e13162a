/**
 * The Roast List for one roast day: what to roast, how much green to pull, and in which batches.
 *
 * - `buildRoastList(input)`: order lines (lot, level, fill grams, quantity) grouped by lot and
 *   level → roasted grams → loss from the loss model with its source → green grams
 *   = ceil(roasted × (1 + overage) ÷ (1 − loss)) → batches within the roaster's load; a pull list
 *   per lot against stock with shortfalls; warnings (day capacity, below the preferred load,
 *   below the hard floor, shortfall). Shape of `GET /api/roastery/days/:date/roast-list`.
 *
 * Green is never under-planned: every rounding on the way (overage, loss, measured loss) is up.
 *
 * A day's list is also its production record: every line stays on it once roasted, packed or
 * shipped. What is still to roast is the roasted weight not yet covered (`coveredRoastedGrams`),
 * planned the same way; the pull list and the warnings count only that.
 */
import { checkDayCapacity, HARD_FLOOR_LOAD_PCT, planBatches, type BatchPlan, type FloorProposal, type RoasterSettings } from './batch-planner';
import { greenNeededForRoasted, resolveExpectedLoss, type LossModel, type LotLossRecord } from './roast-loss';
import { roastLevels, type RoastLevel } from './vocabulary';

export interface RoastOrderLine {
  lotCode: string;
  roastLevel: RoastLevel;
  /** Fill weight of one bag (the declared size rounded up to a gram). */
  fillGrams: number;
  quantity: number;
}

export interface RoastListSettings {
  overagePct: number;
  roaster: RoasterSettings;
  lossModel: LossModel;
  lossModelMinBatches: number;
}

export type LotLossHistory = Readonly<Record<string, Partial<Record<RoastLevel, LotLossRecord>>>>;

/** One lot and level's recorded batches, as a database sums them. */
export interface LotLossRow extends LotLossRecord {
  lotCode: string;
  roastLevel: RoastLevel;
}

export function lotLossHistoryOf(rows: readonly LotLossRow[]): LotLossHistory {
  const history: Record<string, Partial<Record<RoastLevel, LotLossRecord>>> = {};
  for (const { lotCode, roastLevel, ...record } of rows) (history[lotCode] ??= {})[roastLevel] = record;
  return history;
}

export interface RoastListInput {
  date: string;
  lines: readonly RoastOrderLine[];
  settings: RoastListSettings;
  /** What each lot's recorded batches add up to, per level. */
  lotLoss?: LotLossHistory;
  /** Green grams on hand per lot; a missing lot has none. */
  stockGrams: Readonly<Record<string, number>>;
  dayCapacityGrams: number;
  /**
   * Roasted grams per lot and level that need no more roasting: bags already roasted, packed or
   * shipped, and the day's recorded roast no bag has taken yet. Missing means none.
   */
  coveredRoastedGrams?: Readonly<Record<string, Partial<Record<RoastLevel, number>>>>;
}

/** What a line (or the day) still needs after what is already roasted. */
export interface StillToRoast {
  roastedGrams: number;
  greenGrams: number;
  batches: { greenGrams: number }[];
}

/**
 * One lot and level of the day's record: what was planned for all its bags (`roastedGrams`,
 * `greenGrams`, `batches`) and what is still to roast. The floor proposal is for what is still to roast.
 */
export interface RoastListLine {
  lotCode: string;
  roastLevel: RoastLevel;
  bags: number;
  roastedGrams: number;
  lossPct: number;
  lossSource: 'level' | 'lot';
  greenGrams: number;
  batches: { greenGrams: number }[];
  toRoast: StillToRoast;
  floorProposal?: FloorProposal;
}

export interface PullLine {
  lotCode: string;
  greenGrams: number;
  stockGrams: number;
  shortfallGrams: number;
}

export type RoastListWarningCode = 'over_day_capacity' | 'below_preferred_load' | 'below_minimum_load' | 'green_shortfall';

export interface RoastListWarning {
  code: RoastListWarningCode;
  message: string;
  lotCode?: string;
  roastLevel?: RoastLevel;
}

export interface RoastList {
  date: string;
  lines: RoastListLine[];
  pull: PullLine[];
  /** The whole day as planned; `toRoast` is what is left of it. */
  totals: { roastedGrams: number; greenGrams: number; batches: number; toRoast: { roastedGrams: number; greenGrams: number; batches: number } };
  warnings: RoastListWarning[];
}

function levelOrder(level: RoastLevel): number {
  const order = roastLevels.indexOf(level);
  if (order < 0) throw new RangeError(`unknown roast level ${String(level)}`);
  return order;
}

interface LotLevelTotal {
  lotCode: string;
  roastLevel: RoastLevel;
  roastedGrams: number;
  bags: number;
}

/** Open-addressing table of parallel arrays, keyed by (lot code, roast level). */
interface TotalsTable {
  mask: number;
  used: number;
  /** '' marks an empty slot; lot codes are never empty. */
  lotCodes: string[];
  levels: string[];
  roasted: Float64Array;
  bags: Float64Array;
}

function newTable(capacity: number): TotalsTable {
  return {
    mask: capacity - 1,
    used: 0,
    lotCodes: new Array<string>(capacity).fill(''),
    levels: new Array<string>(capacity).fill(''),
    roasted: new Float64Array(capacity),
    bags: new Float64Array(capacity),
  };
}

// Lot codes mostly differ in their last characters (numbering); levels differ in length and first letter.
function slotHash(lotCode: string, level: string): number {
  const length = lotCode.length;
  return length * 7 + lotCode.charCodeAt(length - 1) * 37 + lotCode.charCodeAt(length - 2) * 1031 + level.length * 59 + level.charCodeAt(0) * 3;
}

/** The slot holding (lotCode, level), claiming an empty one when the pair is new (checked then). */
function claimSlot(table: TotalsTable, lotCode: string, level: RoastLevel): number {
  for (let slot = slotHash(lotCode, level) & table.mask; ; slot = (slot + 1) & table.mask) {
    const code = table.lotCodes[slot];
    if (code === '') {
      if (lotCode === '') throw new RangeError('an order line has no lot code');
      levelOrder(level);
      table.lotCodes[slot] = lotCode;
      table.levels[slot] = level;
      table.used += 1;
      return slot;
    }
    if (code === lotCode && table.levels[slot] === level) return slot;
  }
}

function tableEntries(table: TotalsTable): LotLevelTotal[] {
  const entries: LotLevelTotal[] = [];
  table.lotCodes.forEach((lotCode, slot) => {
    if (lotCode !== '') {
      entries.push({
        lotCode,
        roastLevel: table.levels[slot] as RoastLevel,
        roastedGrams: table.roasted[slot] as number,
        bags: table.bags[slot] as number,
      });
    }
  });
  return entries;
}

function grownTable(table: TotalsTable): TotalsTable {
  const grown = newTable((table.mask + 1) * 2);
  for (const entry of tableEntries(table)) {
    const slot = claimSlot(grown, entry.lotCode, entry.roastLevel);
    grown.roasted[slot] = entry.roastedGrams;
    grown.bags[slot] = entry.bags;
  }
  return grown;
}

/**
 * Sums order lines per lot and level. A Map lookup per line would cost more than everything
 * else the list does, and a day can hold tens of thousands of lines; the common case here is a
 * hash of four characters and two string comparisons.
 */
function totalsByLotAndLevel(lines: readonly RoastOrderLine[]): LotLevelTotal[] {
  let table = newTable(1024);
  // Local aliases keep the hot loop free of property loads; they are refreshed when the table grows.
  let { mask, lotCodes, levels, roasted, bags } = table;
  for (let index = 0; index < lines.length; index += 1) {
    const line = lines[index] as RoastOrderLine;
    const { fillGrams, quantity, lotCode, roastLevel } = line;
    // `x | 0` is x only for whole numbers below 2^31: far beyond any bag or order.
    if (!(fillGrams > 0 && quantity > 0 && (fillGrams | 0) === fillGrams && (quantity | 0) === quantity)) {
      throw new RangeError(`order line for ${lotCode} needs whole fill grams and quantity > 0`);
    }
    let slot = slotHash(lotCode, roastLevel) & mask;
    if (lotCodes[slot] !== lotCode || levels[slot] !== roastLevel) {
      slot = claimSlot(table, lotCode, roastLevel);
      // Keep the table at most a quarter full, so most pairs sit in their first slot.
      if (table.used * 4 > mask + 1) {
        table = grownTable(table);
        ({ mask, lotCodes, levels, roasted, bags } = table);
        slot = claimSlot(table, lotCode, roastLevel);
      }
    }
    (roasted[slot] as number) += fillGrams * quantity;
    (bags[slot] as number) += quantity;
  }
  return tableEntries(table);
}

// Plain digit grouping: Intl formatting costs more than building the whole list.
function grams(value: number): string {
  return `${String(value).replace(/\B(?=(\d{3})+(?!\d))/g, ',')} g`;
}

function loadWarnings(line: Pick<RoastListLine, 'lotCode' | 'roastLevel'>, settings: RoastListSettings, plan: BatchPlan): RoastListWarning[] {
  const subject = `${line.lotCode} at ${line.roastLevel}`;
  const count = plan.batches.length;
  const smallest = plan.batches.at(-1) ?? 0;
  const batchText = count === 1 ? `1 batch of ${grams(smallest)}` : `${count} batches of about ${grams(smallest)}`;
  const { capacityGrams, minLoadPct } = settings.roaster;
  if (plan.floorProposal) {
    const proposal = plan.floorProposal;
    return [
      {
        code: 'below_minimum_load',
        lotCode: line.lotCode,
        roastLevel: line.roastLevel,
        message:
          `${subject}: ${batchText} is under ${HARD_FLOOR_LOAD_PCT} % of the roaster's ${grams(capacityGrams)}, too small to control well. ` +
          `Raise each batch to ${grams(proposal.batchGreenGrams)}: ${grams(proposal.extraGreenGrams)} more green, ` +
          `about ${grams(proposal.extraRoastedGrams)} roasted to stock.`,
      },
    ];
  }
  if (plan.belowPreferredLoad) {
    return [
      {
        code: 'below_preferred_load',
        lotCode: line.lotCode,
        roastLevel: line.roastLevel,
        message:
          `${subject}: ${batchText} is below the preferred minimum load of ` +
          `${grams(plan.limits.preferredMinGrams)} (${minLoadPct} % of ${grams(capacityGrams)}).`,
      },
    ];
  }
  return [];
}

export function buildRoastList(input: RoastListInput): RoastList {
  const { settings } = input;
  const byLot = new Map<string, LotLevelTotal[]>();
  const sorted = totalsByLotAndLevel(input.lines).sort((a, b) =>
    a.lotCode < b.lotCode ? -1 : a.lotCode > b.lotCode ? 1 : levelOrder(a.roastLevel) - levelOrder(b.roastLevel),
  );
  for (const group of sorted) {
    const lotGroups = byLot.get(group.lotCode);
    if (lotGroups) lotGroups.push(group);
    else byLot.set(group.lotCode, [group]);
  }
  const lines: RoastListLine[] = [];
  const warnings: RoastListWarning[] = [];
  const pull: PullLine[] = [];
  const totals = { roastedGrams: 0, greenGrams: 0, batches: 0, toRoast: { roastedGrams: 0, greenGrams: 0, batches: 0 } };

  for (const [lotCode, lotGroups] of byLot) {
    let lotGreenToPull = 0;
    for (const group of lotGroups) {
      const { roastLevel } = group;
      const loss = resolveExpectedLoss(roastLevel, settings.lossModel, input.lotLoss?.[lotCode]?.[roastLevel], settings.lossModelMinBatches);
      const greenGrams = greenNeededForRoasted(group.roastedGrams, loss.lossPct, settings.overagePct);
      const plan = planBatches(greenGrams, settings.roaster, loss.lossPct);
      const covered = input.coveredRoastedGrams?.[lotCode]?.[roastLevel] ?? 0;
      const remainingRoasted = Math.max(0, group.roastedGrams - covered);
      const remainingGreen = remainingRoasted > 0 ? greenNeededForRoasted(remainingRoasted, loss.lossPct, settings.overagePct) : 0;
      // Nothing roasted yet: what is left is the plan itself.
      const remainingPlan = covered === 0 ? plan : remainingGreen > 0 ? planBatches(remainingGreen, settings.roaster, loss.lossPct) : undefined;
      const line: RoastListLine = {
        lotCode,
        roastLevel,
        bags: group.bags,
        roastedGrams: group.roastedGrams,
        lossPct: loss.lossPct,
        lossSource: loss.source,
        greenGrams,
        batches: plan.batches.map((load) => ({ greenGrams: load })),
        toRoast: {
          roastedGrams: remainingRoasted,
          greenGrams: remainingGreen,
          batches: remainingPlan ? remainingPlan.batches.map((load) => ({ greenGrams: load })) : [],
        },
      };
      if (remainingPlan?.floorProposal) line.floorProposal = remainingPlan.floorProposal;
      lines.push(line);
      if (remainingPlan) warnings.push(...loadWarnings(line, settings, remainingPlan));
      lotGreenToPull += remainingGreen;
      totals.roastedGrams += group.roastedGrams;
      totals.greenGrams += greenGrams;
      totals.batches += plan.batches.length;
      totals.toRoast.roastedGrams += remainingRoasted;
      totals.toRoast.greenGrams += remainingGreen;
      totals.toRoast.batches += line.toRoast.batches.length;
    }
    if (lotGreenToPull === 0) continue;
    const stockGrams = input.stockGrams[lotCode] ?? 0;
    const shortfallGrams = Math.max(0, lotGreenToPull - stockGrams);
    pull.push({ lotCode, greenGrams: lotGreenToPull, stockGrams, shortfallGrams });
    if (shortfallGrams > 0) {
      warnings.push({
        code: 'green_shortfall',
        lotCode,
        message: `${lotCode}: the list needs ${grams(lotGreenToPull)} of green and ${grams(stockGrams)} is in stock, ${grams(shortfallGrams)} short.`,
      });
    }
  }

  const capacity = checkDayCapacity(totals.toRoast.greenGrams, input.dayCapacityGrams);
  if (!capacity.withinCapacity) {
    warnings.unshift({
      code: 'over_day_capacity',
      message:
        `The day plans ${grams(totals.toRoast.greenGrams)} of green still to roast against a capacity of ` +
        `${grams(input.dayCapacityGrams)}, ${grams(capacity.overByGrams)} over.`,
    });
  }
  return { date: input.date, lines, pull, totals, warnings };
}
