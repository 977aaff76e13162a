// The one clock of the staff pages: every instant read in the shop's time zone, with the zone's
// label, so the Day Sheet, Stock history and an order all name the same moment the same way.

const locale = 'en-US';

export type ShopClockStyle = 'time' | 'date' | 'date-time';

const styleOptions: Record<ShopClockStyle, Intl.DateTimeFormatOptions> = {
  // "10:03 AM CST"
  time: { hour: 'numeric', minute: '2-digit', timeZoneName: 'short' },
  // "Dec 3, 2026": the shop's day of the instant (a day needs no zone label)
  date: { month: 'short', day: 'numeric', year: 'numeric' },
  // "Dec 3, 2026, 10:03 AM CST"
  'date-time': { month: 'short', day: 'numeric', year: 'numeric', hour: 'numeric', minute: '2-digit', timeZoneName: 'short' },
};

const formats = new Map<string, Intl.DateTimeFormat>();

function formatFor(style: ShopClockStyle, timeZone: string | undefined): Intl.DateTimeFormat {
  const key = `${style}|${timeZone ?? ''}`;
  let format = formats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat(locale, { ...styleOptions[style], timeZone });
    formats.set(key, format);
  }
  return format;
}

/**
 * An instant on the shop's clock: `timeZone` is the shop's IANA zone (shop settings hold it); left
 * out (settings not loaded yet) it reads in the reader's own zone, still labelled, so it is never
 * mistaken for shop time.
 */
export function formatShopInstant(instant: string | Date, timeZone: string | undefined, style: ShopClockStyle): string {
  return formatFor(style, timeZone).format(new Date(instant));
}
