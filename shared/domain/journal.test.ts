import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compareWithGuide, formatClock, JOURNAL_SUMMARY_MINIMUM, median, parseClock, roastPhases, summarizeLotRoasts, type SummarizableRoast } from './journal';
import { roastLevels } from './vocabulary';

describe('roast clock times', () => {
  it('reads m:ss and mm:ss, and refuses anything else', () => {
    expect(parseClock('3:25')).toBe(205);
    expect(parseClock(' 12:05 ')).toBe(725);
    expect(parseClock('3:60')).toBeUndefined();
    expect(parseClock('205')).toBeUndefined();
    expect(parseClock('')).toBeUndefined();
    expect(formatClock(205)).toBe('3:25');
    expect(formatClock(59)).toBe('0:59');
  });

  it('writes back what it reads, for every time under 100 minutes', () => {
    fc.assert(fc.property(fc.integer({ min: 0, max: 99 * 60 + 59 }), (seconds) => parseClock(formatClock(seconds)) === seconds));
  });
});

describe('roast phases', () => {
  it('splits the hand-worked roast into drying, browning and development', () => {
    // Yellow 2:30, first crack 3:00, end 3:25: drying 0–150 s, browning 150–180 s, development 180–205 s (phases: common practice).
    expect(roastPhases({ yellowSeconds: 150, firstCrackSeconds: 180, endSeconds: 205 })).toEqual([
      { phase: 'drying', startSeconds: 0, endSeconds: 150 },
      { phase: 'browning', startSeconds: 150, endSeconds: 180 },
      { phase: 'development', startSeconds: 180, endSeconds: 205 },
    ]);
  });

  it('covers the whole roast without gaps, whichever times were recorded', () => {
    fc.assert(
      fc.property(fc.integer({ min: 3, max: 3600 }), fc.boolean(), fc.boolean(), (end, withYellow, withCrack) => {
        const yellow = withYellow ? Math.floor(end / 3) : undefined;
        const crack = withCrack ? end - 1 : undefined;
        const spans = roastPhases({ yellowSeconds: yellow, firstCrackSeconds: crack, endSeconds: end });
        expect(spans[0]!.startSeconds).toBe(0);
        expect(spans.at(-1)!.endSeconds).toBe(end);
        spans.slice(1).forEach((span, index) => expect(span.startSeconds).toBe(spans[index]!.endSeconds));
      }),
    );
  });
});

describe('comparison with the Home Roast Guide', () => {
  it('says how far past first crack a popper roast went against the suggested level', () => {
    // A popper's medium: 20–30 s after first crack (home-roasting common practice).
    const comparison = compareWithGuide({ device: 'popper', developmentSeconds: 45, estimatedLevel: 'medium-dark' }, 'medium');
    expect(comparison.guide).toEqual({ afterFirstCrackSeconds: { min: 20, max: 30 }, position: 'past' });
    expect(comparison.message).toBe(
      "You went 45 s past first crack; the guide's medium is 20–30 s. You reached medium-dark, darker than the suggested medium.",
    );
  });

  it('takes the level the roaster names over the estimate, and gives no timing for a device without guide numbers', () => {
    const comparison = compareWithGuide({ device: 'stovetop-pan', developmentSeconds: 45, levelReached: 'light', estimatedLevel: 'medium' }, 'medium');
    expect(comparison.guide).toBeUndefined();
    expect(comparison.levelComparedWithSuggestion).toBe('lighter');
    expect(comparison.message).toBe('You reached light, lighter than the suggested medium.');
  });
});

describe('per-lot summaries', () => {
  const roast = (customerId: string, fields: Partial<SummarizableRoast> = {}): SummarizableRoast => ({
    customerId,
    lossPct: 15,
    developmentSeconds: 25,
    estimatedLevel: 'medium',
    ...fields,
  });

  it('gives nothing below 5 roasts from 3 customers', () => {
    expect(JOURNAL_SUMMARY_MINIMUM).toEqual({ roasts: 5, customers: 3 });
    expect(
      summarizeLotRoasts(
        ['a', 'b', 'c', 'a'].map((id) => roast(id)),
        'medium',
      ),
    ).toBeNull();
    expect(
      summarizeLotRoasts(
        ['a', 'b', 'a', 'b', 'a', 'b'].map((id) => roast(id)),
        'medium',
      ),
    ).toBeNull();
  });

  it('at the minimum: counts, medians and the spread of levels, and no disagreement when most agree', () => {
    const summary = summarizeLotRoasts(
      [
        roast('a', { lossPct: 14 }),
        roast('b', { lossPct: 15.5 }),
        roast('c', { lossPct: 16, levelReached: 'medium-dark' }),
        roast('a'),
        roast('b', { developmentSeconds: undefined }),
      ],
      'medium',
    );
    expect(summary).toEqual({
      roasts: 5,
      customers: 3,
      medianLossPct: 15,
      medianDevelopmentSeconds: null,
      levels: [
        { level: 'medium', roasts: 4 },
        { level: 'medium-dark', roasts: 1 },
      ],
      disagreement: null,
    });
  });

  it('notes a disagreement only from 5 roasts by 3 customers off the suggested level', () => {
    const darker = ['a', 'b', 'c', 'a', 'b'].map((id) => roast(id, { estimatedLevel: 'dark' }));
    expect(summarizeLotRoasts(darker, 'medium')?.disagreement).toEqual({ roasts: 5, customers: 3, mostly: 'darker' });
    const offByTwo = [...['a', 'b', 'a', 'b', 'a'].map((id) => roast(id, { estimatedLevel: 'light' })), roast('c')];
    expect(summarizeLotRoasts(offByTwo, 'medium')?.disagreement).toBeNull();
  });

  it('finds the median of any list between its least and greatest value', () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([1, 2, 3, 4])).toBe(2.5);
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 10_000 }), { minLength: 1 }), (values) => {
        const middle = median(values);
        return middle >= Math.min(...values) && middle <= Math.max(...values);
      }),
    );
  });

  it('counts every roast in exactly one level', () => {
    fc.assert(
      fc.property(fc.array(fc.record({ customer: fc.constantFrom('a', 'b', 'c', 'd'), level: fc.constantFrom(...roastLevels) }), { minLength: 5 }), (rows) => {
        const summary = summarizeLotRoasts(
          rows.map((row) => roast(row.customer, { estimatedLevel: row.level })),
          'medium',
        );
        if (summary) expect(summary.levels.reduce((sum, row) => sum + row.roasts, 0)).toBe(rows.length);
      }),
    );
  });
});
