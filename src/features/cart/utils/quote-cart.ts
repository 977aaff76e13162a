import { BagTooHeavyForShipping } from '@shared/domain/parcel-packing';
import { quoteGreenOrder, type GreenLotPrice, type Quote } from '@shared/domain/pricing';
import type { GreenCheckoutItem } from '@shared/schemas/checkout';
import type { ShippingRules } from '@shared/schemas/shipping';
import type { CartLine } from '../stores/cart-store';

/** The items `POST /api/checkout/green` takes, one per cart line. */
export function toCheckoutItems(lines: readonly CartLine[]): GreenCheckoutItem[] {
  return lines.map(({ lotCode, size, quantity }) => ({ lotCode, size, quantity }));
}

export type CartQuote = { ok: true; quote: Quote } | { ok: false; message: string };

/**
 * The cart priced by the trade engine with the shop's shipping rules from `GET /api/shipping`,
 * exactly as checkout prices it (quantity breaks count every size of a lot together; bags packed
 * whole into the cheapest parcels). The server prices the order again.
 */
export function quoteCart(lines: readonly CartLine[], shipping: ShippingRules): CartQuote {
  const prices: Record<string, GreenLotPrice> = Object.fromEntries(
    lines.map((line) => [line.lotCode, { pricePerKgCents: line.pricePerKgCents, priceBreaks: line.priceBreaks }]),
  );
  try {
    return { ok: true, quote: quoteGreenOrder(toCheckoutItems(lines), prices, { shipping }) };
  } catch (error) {
    if (!(error instanceof BagTooHeavyForShipping)) throw error;
    return { ok: false, message: 'One of these bags is too heavy for the shop to ship in one parcel. Choose a smaller size.' };
  }
}
