import { describe, expect, it } from 'vitest';
import { hasActiveFilters, lotFiltersToSearchParams, parseLotFilters } from './lot-filters';

describe('lot filters in the URL', () => {
  it('reads every filter the API accepts', () => {
    const filters = parseLotFilters(new URLSearchParams('q=%20cocoa%20&origin=Brazil&process=natural&level=medium-dark&inStock=true'));
    expect(filters).toEqual({ q: 'cocoa', origin: 'Brazil', process: 'natural', level: 'medium-dark', inStock: true });
  });

  it('drops values the API would refuse, empty values and a false in-stock flag', () => {
    expect(parseLotFilters(new URLSearchParams('process=roasted&level=charcoal&q=&origin=%20&inStock=false'))).toEqual({});
    expect(parseLotFilters(new URLSearchParams('inStock=maybe'))).toEqual({});
  });

  it('writes only the filters that are set, in a stable order, and reads back the same', () => {
    const search = lotFiltersToSearchParams({ inStock: true, level: 'light', q: 'berry' });
    expect(search.toString()).toBe('q=berry&level=light&inStock=true');
    expect(parseLotFilters(search)).toEqual({ inStock: true, level: 'light', q: 'berry' });
  });

  it('reads price bounds and the sort, and drops bounds that cross or are not whole cents', () => {
    expect(parseLotFilters(new URLSearchParams('minPricePerKgCents=1800&maxPricePerKgCents=2500&sort=price-desc'))).toEqual({
      minPricePerKgCents: 1800,
      maxPricePerKgCents: 2500,
      sort: 'price-desc',
    });
    expect(parseLotFilters(new URLSearchParams('minPricePerKgCents=2500&maxPricePerKgCents=1800'))).toEqual({});
    expect(parseLotFilters(new URLSearchParams('minPricePerKgCents=18.5&sort=cheapest'))).toEqual({});
    expect(parseLotFilters(new URLSearchParams('sort=origin'))).toEqual({});
  });

  it('knows when any filter is active', () => {
    expect(hasActiveFilters({ sort: 'name' })).toBe(false);
    expect(hasActiveFilters({ maxPricePerKgCents: 2000 })).toBe(true);
    expect(hasActiveFilters({})).toBe(false);
    expect(hasActiveFilters({ inStock: false })).toBe(false);
    expect(hasActiveFilters({ origin: 'Kenya' })).toBe(true);
  });
});
