import type { StoredPostalAddress } from '../schemas/address';

/**
 * A postal address as the lines a label, a page or an e-mail prints, name first; no empty line
 * where there is no second street line.
 */
export function addressLines(address: StoredPostalAddress): string[] {
  return [address.name, address.line1, address.line2 ?? '', `${address.city}, ${address.region} ${address.postalCode}`, address.country].filter(Boolean);
}
