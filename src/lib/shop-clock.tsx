import { createContext, useContext, useMemo } from 'react';
import { formatShopInstant } from '@shared/domain/shop-clock';

/** The shop's IANA time zone on the staff pages (the Roastery layout provides it from shop settings). */
const ShopTimeZoneContext = createContext<string | undefined>(undefined);

export const ShopTimeZoneProvider = ShopTimeZoneContext.Provider;

export interface ShopClock {
  /** "10:03 AM CST" */
  time: (instant: string | Date) => string;
  /** The shop's day of an instant: "Dec 3, 2026" */
  date: (instant: string | Date) => string;
  /** "Dec 3, 2026, 10:03 AM CST" */
  dateTime: (instant: string | Date) => string;
}

/**
 * Every time on a staff page goes through this: the shop's zone, labelled. Before shop settings
 * load it reads the reader's own zone, still labelled.
 */
export function useShopClock(): ShopClock {
  const timeZone = useContext(ShopTimeZoneContext);
  return useMemo(
    () => ({
      time: (instant) => formatShopInstant(instant, timeZone, 'time'),
      date: (instant) => formatShopInstant(instant, timeZone, 'date'),
      dateTime: (instant) => formatShopInstant(instant, timeZone, 'date-time'),
    }),
    [timeZone],
  );
}
