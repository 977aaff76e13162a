/**
 * The Roast Journal: what Restday reads from a customer's home roasts, one at a time and per lot.
 *
 * - `parseClock(text)` / `formatClock(seconds)`: roast times as a roaster writes them (`3:25`).
 * - `roastPhases(entry)`: drying, browning and development as spans on the roast's time axis.
 * - `compareWithGuide(entry, suggestedLevel)`: the roast against the lot's suggested level and, for a
 *   device the Home Roast Guide has numbers for, against the guide's time after first crack.
 * - `summarizeLotRoasts(roasts, suggestedLevel)`: anonymous figures for one lot, only from
 *   `JOURNAL_SUMMARY_MINIMUM` roasts by as many customers, so no single customer can be read off.
 */
import { homeRoastProfiles } from './home-roast-guide';
import { roastLevelLabels, roastLevels, type HomeRoastDevice, type RoastLevel } from './vocabulary';

/** The fewest roasts, from the fewest customers, that any per-lot figure is shown from. */
export const JOURNAL_SUMMARY_MINIMUM = { roasts: 5, customers: 3 } as const;

const clockPattern = /^(\d{1,2}):([0-5]\d)$/;

/** `m:ss` or `mm:ss` → whole seconds; undefined for anything else. */
export function parseClock(text: string): number | undefined {
  const match = clockPattern.exec(text.trim());
  if (!match) return undefined;
  return Number(match[1]) * 60 + Number(match[2]);
}

/** Whole seconds → `m:ss`. */
export function formatClock(seconds: number): string {
  const whole = Math.max(0, Math.round(seconds));
  return `${Math.floor(whole / 60)}:${String(whole % 60).padStart(2, '0')}`;
}

export interface RoastTimes {
  yellowSeconds?: number | undefined;
  firstCrackSeconds?: number | undefined;
  endSeconds: number;
}

export interface RoastPhaseSpan {
  phase: 'drying' | 'browning' | 'development';
  startSeconds: number;
  endSeconds: number;
}

/**
 * Drying runs to yellow, browning from yellow to first crack, development from first crack to the
 * end. A time not recorded merges its neighbouring phases; with neither, the roast is one span.
 */
export function roastPhases({ yellowSeconds, firstCrackSeconds, endSeconds }: RoastTimes): RoastPhaseSpan[] {
  const spans: RoastPhaseSpan[] = [];
  const browningEnd = firstCrackSeconds ?? endSeconds;
  if (yellowSeconds !== undefined) spans.push({ phase: 'drying', startSeconds: 0, endSeconds: yellowSeconds });
  if (yellowSeconds !== undefined || firstCrackSeconds !== undefined) {
    spans.push({ phase: 'browning', startSeconds: yellowSeconds ?? 0, endSeconds: browningEnd });
  } else {
    spans.push({ phase: 'drying', startSeconds: 0, endSeconds });
  }
  if (firstCrackSeconds !== undefined) spans.push({ phase: 'development', startSeconds: firstCrackSeconds, endSeconds });
  return spans;
}

export type LevelComparison = 'lighter' | 'same' | 'darker';

export interface GuideComparison {
  suggestedLevel: RoastLevel;
  /** The level reached as the roaster says, else as the loss points to. */
  level: RoastLevel;
  levelComparedWithSuggestion: LevelComparison;
  /** The guide's time after first crack for the suggested level on this device, when it has one. */
  guide?: {
    afterFirstCrackSeconds: { min: number; max: number };
    position: 'short' | 'within' | 'past';
  };
  /** One plain sentence for the roaster. */
  message: string;
}

export interface ComparableRoast {
  device: HomeRoastDevice;
  developmentSeconds?: number | undefined;
  levelReached?: RoastLevel | undefined;
  estimatedLevel: RoastLevel;
}

function compareLevels(level: RoastLevel, suggested: RoastLevel): LevelComparison {
  const difference = roastLevels.indexOf(level) - roastLevels.indexOf(suggested);
  return difference < 0 ? 'lighter' : difference > 0 ? 'darker' : 'same';
}

const levelName = (level: RoastLevel) => roastLevelLabels[level].toLowerCase();
const span = ({ min, max }: { min: number; max: number }) => (min === max ? `about ${min} s` : `${min}–${max} s`);

export function compareWithGuide(roast: ComparableRoast, suggestedLevel: RoastLevel): GuideComparison {
  const level = roast.levelReached ?? roast.estimatedLevel;
  const levelComparedWithSuggestion = compareLevels(level, suggestedLevel);
  const levelSentence =
    levelComparedWithSuggestion === 'same'
      ? `You reached ${levelName(level)}, the level this lot is suggested at.`
      : `You reached ${levelName(level)}, ${levelComparedWithSuggestion} than the suggested ${levelName(suggestedLevel)}.`;
  const profile = homeRoastProfiles[roast.device];
  if (!profile || roast.developmentSeconds === undefined) return { suggestedLevel, level, levelComparedWithSuggestion, message: levelSentence };
  const target = profile.afterFirstCrackSeconds[suggestedLevel];
  const development = roast.developmentSeconds;
  const position = development < target.min ? 'short' : development > target.max ? 'past' : 'within';
  const guideSentence = `You went ${development} s past first crack; the guide's ${levelName(suggestedLevel)} is ${span(target)}.`;
  return {
    suggestedLevel,
    level,
    levelComparedWithSuggestion,
    guide: { afterFirstCrackSeconds: { ...target }, position },
    message: `${guideSentence} ${levelSentence}`,
  };
}

export interface SummarizableRoast {
  customerId: string;
  lossPct: number;
  developmentSeconds?: number | undefined;
  levelReached?: RoastLevel | undefined;
  estimatedLevel: RoastLevel;
}

export interface LotRoastSummary {
  roasts: number;
  customers: number;
  medianLossPct: number;
  /** Null when fewer than the minimum roasts recorded first crack. */
  medianDevelopmentSeconds: number | null;
  /** Roasts per level reached (as the roaster said, else as the loss points to), lightest first. */
  levels: { level: RoastLevel; roasts: number }[];
  /** Set when enough roasts, from enough customers, landed on another level than the suggestion (`mostly`: ties count as darker). */
  disagreement: { roasts: number; customers: number; mostly: 'lighter' | 'darker' } | null;
}

/** The middle value; the mean of the two middle values for an even count, to two decimals. */
export function median(values: readonly number[]): number {
  if (values.length === 0) throw new RangeError('the median of no values');
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  const value = sorted.length % 2 === 1 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
  return Math.round(value * 100) / 100;
}

const enough = (roasts: number, customers: number) => roasts >= JOURNAL_SUMMARY_MINIMUM.roasts && customers >= JOURNAL_SUMMARY_MINIMUM.customers;

/** Anonymous figures for one lot's journal roasts, or null below the minimum. */
export function summarizeLotRoasts(roasts: readonly SummarizableRoast[], suggestedLevel: RoastLevel): LotRoastSummary | null {
  const customers = new Set(roasts.map((roast) => roast.customerId)).size;
  if (!enough(roasts.length, customers)) return null;
  const developments = roasts.flatMap((roast) => (roast.developmentSeconds === undefined ? [] : [roast.developmentSeconds]));
  const levelOf = (roast: SummarizableRoast) => roast.levelReached ?? roast.estimatedLevel;
  const levels = roastLevels.map((level) => ({ level, roasts: roasts.filter((roast) => levelOf(roast) === level).length })).filter((row) => row.roasts > 0);
  const off = roasts.filter((roast) => levelOf(roast) !== suggestedLevel);
  const offCustomers = new Set(off.map((roast) => roast.customerId)).size;
  const darker = off.filter((roast) => compareLevels(levelOf(roast), suggestedLevel) === 'darker').length;
  const disagreement: LotRoastSummary['disagreement'] = enough(off.length, offCustomers)
    ? { roasts: off.length, customers: offCustomers, mostly: darker * 2 >= off.length ? 'darker' : 'lighter' }
    : null;
  return {
    roasts: roasts.length,
    customers,
    medianLossPct: median(roasts.map((roast) => roast.lossPct)),
    medianDevelopmentSeconds: developments.length >= JOURNAL_SUMMARY_MINIMUM.roasts ? Math.round(median(developments)) : null,
    levels,
    disagreement,
  };
}
