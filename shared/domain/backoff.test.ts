import { describe, expect, it } from 'vitest';
import { backoffDelayMs } from './backoff';

describe('backoffDelayMs', () => {
  it('waits the initial delay first, doubles it on each attempt, and stops at the ceiling', () => {
    expect([1, 2, 3, 4, 5, 6].map((attempt) => backoffDelayMs(500, 5000, attempt))).toEqual([500, 1000, 2000, 4000, 5000, 5000]);
  });

  it('stays at the ceiling however many attempts have failed', () => {
    expect(backoffDelayMs(250, 60_000, 10_000)).toBe(60_000);
  });
});
