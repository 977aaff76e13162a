import { useLots } from '../api/get-lots';

/** The origins of every listed lot, for the origin filter; empty until the catalog has loaded. */
export function useLotOrigins(): string[] {
  const allLots = useLots();
  const origins = new Set(allLots.data?.items.map((lot) => lot.origin));
  return [...origins].sort((a, b) => a.localeCompare(b));
}
