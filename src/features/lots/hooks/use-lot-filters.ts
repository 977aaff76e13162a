import { useSearchParams } from 'react-router-dom';
import { lotFiltersToSearchParams, parseLotFilters, type LotFilters } from '../utils/lot-filters';

/** The Green Lots filters live in the URL, so a filtered list can be bookmarked and shared. */
export function useLotFilters() {
  const [searchParams, setSearchParams] = useSearchParams();
  const filters = parseLotFilters(searchParams);

  function updateFilters(change: Partial<LotFilters>): void {
    setSearchParams(lotFiltersToSearchParams({ ...filters, ...change }));
  }

  return { filters, updateFilters };
}
