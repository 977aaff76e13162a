import { describe, expect, it } from 'vitest';
import { packStageCounts, packStageOf, packStatusOf } from './pack-status';

describe('packStatusOf', () => {
  it('a paid green order is ready to pack, never "not roasted yet": green coffee is sold unroasted', () => {
    expect(packStatusOf({ kind: 'green', status: 'paid' }).label).toBe('Paid, ready to pack');
    expect(packStatusOf({ kind: 'green', status: 'paid' }).label).not.toMatch(/roast/i);
  });

  it('a paid roasted order still waits for its roast', () => {
    expect(packStatusOf({ kind: 'roasted', status: 'paid' }).label).toBe('Paid, not roasted yet');
    expect(packStatusOf({ kind: 'green', status: 'shipped' }).label).toBe('Shipped');
  });
});

describe('packStageOf and packStageCounts', () => {
  it('counts paid and roasted orders to pack, packed and shipped ones apart, and leaves out the rest', () => {
    expect(packStageOf('paid')).toBe('to-pack');
    expect(packStageOf('held')).toBeNull();
    const statuses = ['paid', 'roasted', 'packed', 'shipped', 'shipped', 'cancelled', 'pending_payment'] as const;
    expect(packStageCounts(statuses.map((status) => ({ status })))).toEqual({ 'to-pack': 2, packed: 1, shipped: 2 });
  });
});
