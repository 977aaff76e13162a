/**
 * The carriers a shop ships with are the shop's own data: a name as staff type it on the Pack List
 * and a tracking page address with a `{tracking}` placeholder, which the shipped e-mail fills with
 * the parcel's tracking number.
 *
 * - `isTrackingUrlTemplate(template)`: an https address holding the placeholder.
 * - `trackingUrl(template, trackingNumber)`: the address with the number, URL-encoded, in place.
 * - `findCarrier(carriers, name)`: the shop's carrier by name, ignoring case and surrounding spaces.
 */

export const TRACKING_PLACEHOLDER = '{tracking}';

export interface Carrier {
  name: string;
  trackingUrlTemplate: string;
}

export function isTrackingUrlTemplate(template: string): boolean {
  if (!template.includes(TRACKING_PLACEHOLDER)) return false;
  try {
    const url = new URL(template.replaceAll(TRACKING_PLACEHOLDER, 'X'));
    return url.protocol === 'https:' && url.hostname.includes('.');
  } catch {
    return false;
  }
}

export function trackingUrl(template: string, trackingNumber: string): string {
  return template.replaceAll(TRACKING_PLACEHOLDER, encodeURIComponent(trackingNumber.trim()));
}

const carrierKey = (name: string) => name.trim().toLocaleLowerCase('en-US');

export function findCarrier<C extends Carrier>(carriers: readonly C[], name: string): C | undefined {
  const key = carrierKey(name);
  return carriers.find((carrier) => carrierKey(carrier.name) === key);
}

/** Whether each carrier's name is used once (compared as `findCarrier` compares them). */
export function carrierNamesAreUnique(carriers: readonly Carrier[]): boolean {
  return new Set(carriers.map((carrier) => carrierKey(carrier.name))).size === carriers.length;
}
