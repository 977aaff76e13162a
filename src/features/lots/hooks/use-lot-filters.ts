import { useLayoutEffect, useRef } from 'react';
import { useSearchParams } from 'react-router-dom';
import { lotFiltersToSearchParams, parseLotFilters, type LotFilters } from '../utils/lot-filters';
import { isPriceUnit, type PriceUnit } from '../utils/price-per-unit';

const priceUnitParam = 'priceUnit';

function priceUnitOf(search: URLSearchParams): PriceUnit {
  const unit = search.get(priceUnitParam);
  return isPriceUnit(unit) ? unit : 'kg';
}

/**
 * The Green Lots filters live in the URL, so a filtered list can be bookmarked and shared. The
 * unit prices are read in (`priceUnit=lb`) rides along but is never sent to the API.
 */
export function useLotFilters() {
  const [searchParams, setSearchParams] = useSearchParams();
  // The last URL written, so a second change made before the page re-renders builds on the first;
  // a render of an older URL (the first change landing after the second was made) must not undo it.
  const latest = useRef(searchParams);
  const pending = useRef<string | null>(null);
  useLayoutEffect(() => {
    if (pending.current !== null && pending.current !== searchParams.toString()) return;
    pending.current = null;
    latest.current = searchParams;
  }, [searchParams]);

  function write(change: Partial<LotFilters>, unit?: PriceUnit): void {
    const current = latest.current;
    const search = lotFiltersToSearchParams({ ...parseLotFilters(current), ...change });
    const nextUnit = unit ?? priceUnitOf(current);
    if (nextUnit !== 'kg') search.set(priceUnitParam, nextUnit);
    latest.current = search;
    pending.current = search.toString();
    setSearchParams(search);
  }

  return {
    filters: parseLotFilters(searchParams),
    priceUnit: priceUnitOf(searchParams),
    updateFilters: (change: Partial<LotFilters>) => write(change),
    setPriceUnit: (unit: PriceUnit) => write({}, unit),
  };
}
