import { useSearchParams } from 'react-router-dom';
import { parseRoasteryOrderFilters, roasteryOrderFiltersToSearchParams, type RoasteryOrderFilters } from '../utils/order-filters';

/** The orders table's filters live in the URL, so a filtered view can be bookmarked, shared and reloaded. */
export function useRoasteryOrderFilters() {
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = parseRoasteryOrderFilters(searchParams);

  /** Any change of filter or sort goes back to the first page; a change of page keeps the rest. */
  function updateFilters(change: Partial<RoasteryOrderFilters>): void {
    setSearchParams(roasteryOrderFiltersToSearchParams({ ...filters, page: 1, ...change }));
  }

  return { filters, updateFilters };
}
