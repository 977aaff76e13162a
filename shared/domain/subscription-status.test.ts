import { describe, expect, it } from 'vitest';
import { subscriptionStatusOf } from './subscription-status';

describe('subscriptionStatusOf: the payment service owns the standing, the subscriber owns the pause', () => {
  it('a good standing reads paused while the pause runs, active from its day on', () => {
    expect(subscriptionStatusOf('active', '2031-02-01', '2031-01-06')).toBe('paused');
    expect(subscriptionStatusOf('active', '2031-02-01', '2031-02-01')).toBe('active');
    expect(subscriptionStatusOf('paused', null, '2031-01-06')).toBe('active');
  });

  it('a standing the payment service sets wins over a pause', () => {
    expect(subscriptionStatusOf('past_due', '2031-02-01', '2031-01-06')).toBe('past_due');
    expect(subscriptionStatusOf('cancelled', '2031-02-01', '2031-01-06')).toBe('cancelled');
    expect(subscriptionStatusOf('incomplete', null, '2031-01-06')).toBe('incomplete');
  });
});
