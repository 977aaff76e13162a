const instant = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short' });
const day = new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeZone: 'UTC' });

/** An instant (ISO 8601 UTC) in the reader's own time: "Dec 1, 2026, 4:05 PM". */
export function formatInstant(iso: string): string {
  return instant.format(new Date(iso));
}

/** A shop day (`YYYY-MM-DD`) as written, whatever the reader's time zone: "Dec 4, 2026". */
export function formatShopDay(isoDate: string): string {
  return day.format(new Date(`${isoDate}T00:00:00Z`));
}
