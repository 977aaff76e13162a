import { describe, expect, it } from 'vitest';
import { orderReference } from './order-reference';

describe('orderReference', () => {
  it('is the first eight characters of the id, upper-case', () => {
    expect(orderReference('3f2a9c1e-5b7d-4e21-9a0c-6d8e2f4b1a37')).toBe('3F2A9C1E');
  });
});
