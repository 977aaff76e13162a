import type { StoredPostalAddress } from '../schemas/address';

/**
 * A postal address as the lines a label, a page or an e-mail prints, name first; no empty line
 * where there is no second street line.
 */
export function addressLines(address: StoredPostalAddress): string[] {
  return [address.name, address.line1, address.line2 ?? '', `${address.city}, ${address.region} ${address.postalCode}`, address.country].filter(Boolean);
}

/** True when two addresses reach the same door: every field equal, a missing second line read as none. */
export function samePostalAddress(a: StoredPostalAddress, b: StoredPostalAddress): boolean {
  return (
    a.name === b.name &&
    a.line1 === b.line1 &&
    (a.line2 ?? null) === (b.line2 ?? null) &&
    a.city === b.city &&
    a.region === b.region &&
    a.postalCode === b.postalCode &&
    a.country === b.country
  );
}
