const grams = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });
const kilos = new Intl.NumberFormat('en-US', { maximumFractionDigits: 1 });
const dayName = new Intl.DateTimeFormat('en-US', { weekday: 'long', month: 'long', day: 'numeric', timeZone: 'UTC' });
const shortDay = new Intl.DateTimeFormat('en-US', { weekday: 'short', month: 'short', day: 'numeric', timeZone: 'UTC' });

/** 18_240 → "18.2 kg"; 800 → "800 g": loads read at a glance. */
export function formatLoad(value: number): string {
  return value < 1000 ? `${grams.format(value)} g` : `${kilos.format(value / 1000)} kg`;
}

/** "2026-12-03" → "Thursday, December 3" */
export function formatCalendarDay(date: string): string {
  return dayName.format(new Date(`${date}T00:00:00Z`));
}

/** "2026-12-03" → "Thu, Dec 3" */
export function formatShortDay(date: string): string {
  return shortDay.format(new Date(`${date}T00:00:00Z`));
}
