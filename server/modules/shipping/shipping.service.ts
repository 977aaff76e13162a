import { heaviestBandGrams, loneBagParcelGrams, type ShippingSettings } from '@shared/domain/parcel-packing';
import { bagFillGrams } from '@shared/domain/units';
import type { BagSize } from '@shared/domain/vocabulary';
import { AppError } from '../../lib/app-error';

const grams = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

/**
 * 422 `too_heavy_to_ship`, naming each field whose bag size, alone in its box, is over the
 * heaviest shipping band the owner has set (no packer could ship it). Call before pricing.
 */
export function assertBagsShip(bags: readonly { field: string; size: BagSize }[], shipping: ShippingSettings): void {
  const heaviest = heaviestBandGrams(shipping);
  const fields: Record<string, string> = {};
  for (const { field, size } of bags) {
    const alone = loneBagParcelGrams(bagFillGrams(size), shipping);
    if (alone > heaviest) {
      fields[field] =
        `One bag of this size weighs ${grams.format(alone)} g in its box, over the ${grams.format(heaviest)} g the shop ships in one parcel. Choose a smaller size.`;
    }
  }
  if (Object.keys(fields).length > 0) {
    throw new AppError(422, 'too_heavy_to_ship', 'A bag is too heavy to ship in one parcel.', fields);
  }
}
