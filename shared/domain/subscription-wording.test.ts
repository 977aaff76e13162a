import { describe, expect, it } from 'vitest';
import { pauseNotice, skipNotice, unskipNotice, writtenDay } from './subscription-wording';

const isoDay = /\d{4}-\d{2}-\d{2}/;

describe('what a subscriber is told', () => {
  it('writes every day out; 3 December 2026 is a Thursday (calendar)', () => {
    expect(writtenDay('2026-12-03')).toBe('Thursday, December 3, 2026');
  });

  it('a paid skip names where the payment moves; an unpaid one says it is not charged', () => {
    expect(skipNotice({ roastDate: '2026-12-03', paymentMovesTo: '2026-12-10' })).toBe(
      'Skipped the delivery roasting Thursday, December 3, 2026. It is already paid, so your payment moves to the delivery of Thursday, December 10, 2026.',
    );
    expect(skipNotice({ roastDate: '2026-12-03' })).toBe(
      'Skipped the delivery roasting Thursday, December 3, 2026. It will not be roasted, shipped or charged.',
    );
  });

  it('undo and pause notices carry no ISO dates', () => {
    for (const text of [
      unskipNotice({ roastDate: '2026-12-03', paymentMovesFrom: '2026-12-10' }),
      pauseNotice({ until: '2027-01-04', shipping: ['2026-12-07'], held: [{ from: '2026-12-14', to: '2027-01-04' }] }),
    ]) {
      expect(text).not.toMatch(isoDay);
    }
  });
});
