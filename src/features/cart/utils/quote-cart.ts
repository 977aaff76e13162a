import { quoteGreenOrder, type GreenLotPrice, type Quote } from '@shared/domain/pricing';
import type { GreenCheckoutItem } from '@shared/schemas/checkout';
import { defaultShopSettings } from '@shared/schemas/settings';
import type { CartLine } from '../stores/cart-store';

/** The items `POST /api/checkout/green` takes, one per cart line. */
export function toCheckoutItems(lines: readonly CartLine[]): GreenCheckoutItem[] {
  return lines.map(({ lotCode, size, quantity }) => ({ lotCode, size, quantity }));
}

/**
 * The cart priced by the trade engine, with the shop's shipping bands as checkout applies them
 * (quantity breaks count every size of a lot together). The server prices the order again.
 */
export function quoteCart(lines: readonly CartLine[]): Quote {
  const prices: Record<string, GreenLotPrice> = Object.fromEntries(
    lines.map((line) => [line.lotCode, { pricePerKgCents: line.pricePerKgCents, priceBreaks: line.priceBreaks }]),
  );
  return quoteGreenOrder(toCheckoutItems(lines), prices, defaultShopSettings);
}
