import { bagNetWeightLabel } from '../../shared/domain/labels';
import { grindLabels, roastLevelLabels, type BagSize, type Grind, type RoastLevel } from '../../shared/domain/vocabulary';

/** A shop-local day (YYYY-MM-DD) as people read it: "Thursday, December 3, 2026". */
export function formatDay(isoDate: string): string {
  // Noon UTC of that date, formatted in UTC, is that date whatever the server's own zone.
  return new Intl.DateTimeFormat('en-US', { weekday: 'long', month: 'long', day: 'numeric', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(`${isoDate}T12:00:00Z`),
  );
}

/** An instant in the shop's time zone: "December 3, 2026 at 4:15 PM MST". */
export function formatInstant(instant: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-US', {
    month: 'long',
    day: 'numeric',
    year: 'numeric',
    hour: 'numeric',
    minute: '2-digit',
    timeZoneName: 'short',
    timeZone,
  }).format(instant);
}

/** "1 lb bag — Net Wt 16 oz (1 lb) 454 g"-style description of a bag size. */
export function bagLabel(size: BagSize): string {
  return bagNetWeightLabel(size);
}

export function levelLabel(level: RoastLevel): string {
  return roastLevelLabels[level];
}

export function grindLabel(grind: Grind): string {
  return grindLabels[grind];
}

export function cadenceLabel(weeks: number): string {
  return weeks === 1 ? 'every week' : `every ${weeks} weeks`;
}

export function greeting(name: string): string {
  return name ? `Hello ${name},` : 'Hello,';
}
