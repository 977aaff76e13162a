import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { orderSorts } from '@shared/schemas/orders';
import { orderKinds, orderStatuses } from '@shared/domain/vocabulary';
import {
  ordersCsvHref,
  parseRoasteryOrderFilters,
  roasteryOrderFilterProblems,
  roasteryOrderFiltersToSearchParams,
  type RoasteryOrderFilters,
} from './order-filters';

describe('staff order filters in the URL', () => {
  it('reads every filter the API accepts, with the sort and page', () => {
    const filters = parseRoasteryOrderFilters(
      new URLSearchParams('status=held&kind=roasted&from=2026-11-01&to=2026-11-30&roastDate=2026-12-03&sort=status&page=4'),
    );
    expect(filters).toEqual({ status: 'held', kind: 'roasted', from: '2026-11-01', to: '2026-11-30', roastDate: '2026-12-03', sort: 'status', page: 4 });
  });

  it('drops what the API would refuse and falls back to the newest first, page one', () => {
    expect(parseRoasteryOrderFilters(new URLSearchParams('status=lost&kind=&from=2026-13-40&roastDate=soon&sort=cheapest&page=0'))).toEqual({
      sort: 'newest',
      page: 1,
    });
  });

  it('writes back only what differs from the defaults, and reads back the same (any filters)', () => {
    const day = fc.integer({ min: 0, max: 3650 }).map((offset) => new Date(Date.UTC(2024, 0, 1) + offset * 86_400_000).toISOString().slice(0, 10));
    const filters = fc.record(
      {
        status: fc.constantFrom(...orderStatuses),
        kind: fc.constantFrom(...orderKinds),
        from: day,
        to: day,
        roastDate: day,
        sort: fc.constantFrom(...orderSorts),
        page: fc.integer({ min: 1, max: 500 }),
      },
      { requiredKeys: ['sort', 'page'] },
    );
    fc.assert(
      fc.property(filters, (each: RoasteryOrderFilters) => {
        const search = roasteryOrderFiltersToSearchParams(each);
        expect(parseRoasteryOrderFilters(search)).toEqual(each);
        expect(search.has('sort')).toBe(each.sort !== 'newest');
        expect(search.has('page')).toBe(each.page !== 1);
      }),
    );
  });

  it('points the CSV export at the same filters and sort, without the page', () => {
    expect(ordersCsvHref({ sort: 'newest', page: 1 })).toBe('/api/orders.csv');
    expect(ordersCsvHref({ status: 'paid', roastDate: '2026-12-03', sort: 'total-high', page: 7 })).toBe(
      '/api/orders.csv?status=paid&roastDate=2026-12-03&sort=total-high',
    );
  });

  it('names the last day when the range runs backwards, with the schema’s own words', () => {
    expect(roasteryOrderFilterProblems({ from: '2026-12-09', to: '2026-12-01', sort: 'newest', page: 1 })).toEqual({
      to: 'The first day must not be after the last.',
    });
    expect(roasteryOrderFilterProblems({ from: '2026-12-01', to: '2026-12-01', sort: 'newest', page: 1 })).toEqual({});
  });
});
