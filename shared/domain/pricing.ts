/**
 * Prices, discounts, shipping and totals, all in integer minor units (see money.ts for the one
 * rounding rule). A quote is a list of lines; its total is exactly the sum of its lines.
 *
 * - `pricePerKgFor(totalGrams, lotPrice)`: the lot's per-kg price after quantity breaks.
 * - `greenBagPrice(size, pricePerKgCents)`: a green bag priced on its declared weight.
 * - `quoteGreenOrder(items, lots, settings, taxRule?)`: green bags + shipping + tax.
 * - `quoteSubscriptionDelivery(choice, settings, taxRule?)`: roasted bags − subscription discount
 *   + shipping + tax, for one delivery.
 * - Shipping is `planShipping` (parcel-packing.ts): whole bags in real parcels; a quote carries the plan,
 *   its bags named by the item line's description.
 * - `noSalesTax`: the tax hook, zero for now.
 */
import { percentOf, sumMinor } from './money';
import { planShipping, type ParcelContent, type ShippingPlan, type ShippingSettings } from './parcel-packing';
import { roundHalfUpDiv } from './integer-math';
import { bagFillGrams, bagSizeDeclarations, exactGrams } from './units';
import { roastedBagSizes, type GreenBagSize, type RoastedBagSize } from './vocabulary';

export interface PriceBreak {
  minGrams: number;
  pricePerKgCents: number;
}

export interface GreenLotPrice {
  pricePerKgCents: number;
  priceBreaks: readonly PriceBreak[];
}

export interface PricingSettings {
  roastedBagPriceCents: Record<RoastedBagSize, number>;
  subscriptionDiscountPct: number;
  shipping: ShippingSettings;
}

export interface PriceLine {
  kind: 'item' | 'discount' | 'shipping' | 'tax';
  description: string;
  quantity: number;
  unitCents: number;
  /** quantity × unitCents; negative for a discount. */
  amountCents: number;
}

export interface Quote {
  lines: PriceLine[];
  subtotalCents: number;
  discountCents: number;
  shippingCents: number;
  taxCents: number;
  totalCents: number;
  /** How the bags go into parcels, as the shipping line charges them. */
  shipping: ShippingPlan;
}

/**
 * Sales tax is not charged yet: whether and where the shop must collect it is a question for
 * its accountant. Plug a rule in here (or a tax service) when that is settled.
 */
export type TaxRule = (taxable: { lines: readonly PriceLine[] }) => number;
export const noSalesTax: TaxRule = () => 0;

/**
 * The lowest per-kg price among the base price and every break the quantity reaches. Break
 * thresholds compare with fill grams (what ships), which favours the customer by a gram or so.
 */
export function pricePerKgFor(totalGrams: number, lotPrice: GreenLotPrice): number {
  let price = lotPrice.pricePerKgCents;
  for (const priceBreak of lotPrice.priceBreaks) {
    if (totalGrams >= priceBreak.minGrams && priceBreak.pricePerKgCents < price) price = priceBreak.pricePerKgCents;
  }
  return price;
}

/** Priced on the exact declared weight (1 lb = 453.59237 g), rounded once. */
export function greenBagPrice(size: GreenBagSize, pricePerKgCents: number): number {
  const { numerator, denominator } = exactGrams(bagSizeDeclarations[size]);
  return roundHalfUpDiv(BigInt(pricePerKgCents) * numerator, denominator * 1000n);
}

function itemLine(description: string, quantity: number, unitCents: number): PriceLine {
  if (!Number.isSafeInteger(quantity) || quantity <= 0) throw new RangeError(`quantity must be a whole number > 0, got ${quantity}`);
  return { kind: 'item', description, quantity, unitCents, amountCents: quantity * unitCents };
}

function shippingLine(plan: ShippingPlan): PriceLine {
  const count = plan.parcels.length;
  return {
    kind: 'shipping',
    description: count === 1 ? 'Shipping' : `Shipping (${count} parcels)`,
    quantity: 1,
    unitCents: plan.cents,
    amountCents: plan.cents,
  };
}

function assembleQuote(goods: readonly PriceLine[], shipping: ShippingPlan, taxRule: TaxRule): Quote {
  const lines = [...goods, shippingLine(shipping)];
  const taxCents = taxRule({ lines });
  const all: PriceLine[] = [...lines, { kind: 'tax', description: 'Sales tax', quantity: 1, unitCents: taxCents, amountCents: taxCents }];
  const sumOf = (kind: PriceLine['kind']): number => sumMinor(all.filter((line) => line.kind === kind).map((line) => line.amountCents));
  return {
    lines: all,
    subtotalCents: sumOf('item'),
    discountCents: -sumOf('discount'),
    shippingCents: sumOf('shipping'),
    taxCents,
    totalCents: sumMinor(all.map((line) => line.amountCents)),
    shipping,
  };
}

export interface GreenItem {
  lotCode: string;
  size: GreenBagSize;
  quantity: number;
}

/** Quantity breaks count all sizes of the same lot in the order together. */
export function quoteGreenOrder(
  items: readonly GreenItem[],
  lots: Readonly<Record<string, GreenLotPrice>>,
  settings: Pick<PricingSettings, 'shipping'>,
  taxRule: TaxRule = noSalesTax,
): Quote {
  const gramsPerLot = new Map<string, number>();
  for (const item of items) {
    gramsPerLot.set(item.lotCode, (gramsPerLot.get(item.lotCode) ?? 0) + bagFillGrams(item.size) * item.quantity);
  }
  const lines = items.map((item) => {
    const lot = lots[item.lotCode];
    if (!lot) throw new RangeError(`no price for lot ${item.lotCode}`);
    const perKg = pricePerKgFor(gramsPerLot.get(item.lotCode) ?? 0, lot);
    return itemLine(`${item.lotCode}, green, ${item.size}`, item.quantity, greenBagPrice(item.size, perKg));
  });
  const contents: ParcelContent[] = items.map((item, index) => ({
    key: lines[index]!.description,
    fillGrams: bagFillGrams(item.size),
    quantity: item.quantity,
  }));
  return assembleQuote(lines, planShipping(contents, settings.shipping), taxRule);
}

export interface SubscriptionChoice {
  /** Lot code, or null for the Roaster's Rotation. */
  lotCode: string | null;
  bagSize: RoastedBagSize;
  bagsPerDelivery: number;
}

export function quoteSubscriptionDelivery(choice: SubscriptionChoice, settings: PricingSettings, taxRule: TaxRule = noSalesTax): Quote {
  const coffee = choice.lotCode ?? "Roaster's Rotation";
  const bags = itemLine(`${coffee}, roasted, ${choice.bagSize}`, choice.bagsPerDelivery, settings.roastedBagPriceCents[choice.bagSize]);
  const discountCents = percentOf(bags.amountCents, settings.subscriptionDiscountPct);
  const discount: PriceLine = {
    kind: 'discount',
    description: `Subscription discount (${settings.subscriptionDiscountPct} %)`,
    quantity: 1,
    unitCents: -discountCents,
    amountCents: -discountCents,
  };
  const shipping = planShipping([{ key: bags.description, fillGrams: bagFillGrams(choice.bagSize), quantity: choice.bagsPerDelivery }], settings.shipping);
  return assembleQuote([bags, ...(discountCents > 0 ? [discount] : [])], shipping, taxRule);
}

/** One subscription bag of each roasted size after the subscription discount, before shipping. */
export function subscriptionBagPrices(settings: Pick<PricingSettings, 'roastedBagPriceCents' | 'subscriptionDiscountPct'>): Record<RoastedBagSize, number> {
  return Object.fromEntries(
    roastedBagSizes.map((size) => {
      const regular = settings.roastedBagPriceCents[size];
      return [size, regular - percentOf(regular, settings.subscriptionDiscountPct)];
    }),
  ) as Record<RoastedBagSize, number>;
}
