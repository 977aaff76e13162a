import { describe, expect, it } from 'vitest';
import { packStatusOf } from './pack-status';

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
