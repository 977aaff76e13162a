import { describe, expect, it } from 'vitest';
import { formatExactGrams, formatMinutesSeconds, parseMinutesSeconds } from './roast-day-format';

describe('Day Sheet formatting', () => {
  it('reads roast-timer times as minutes and seconds, and refuses anything else', () => {
    expect(parseMinutesSeconds('11:45')).toBe(705);
    expect(parseMinutesSeconds(' 0:59 ')).toBe(59);
    expect(parseMinutesSeconds('9:05')).toBe(545);
    expect(parseMinutesSeconds('11:60')).toBeNull();
    expect(parseMinutesSeconds('705')).toBeNull();
    expect(parseMinutesSeconds('')).toBeNull();
  });

  it('writes seconds back as minutes and seconds', () => {
    expect(formatMinutesSeconds(705)).toBe('11:45');
    expect(formatMinutesSeconds(545)).toBe('9:05');
  });

  it('keeps grams exact', () => {
    expect(formatExactGrams(4635)).toBe('4,635 g');
  });
});
