import clsx from 'clsx';
import { useId, useState } from 'react';
import { Link } from 'react-router-dom';
import { greenBagPrice, pricePerKgFor } from '@shared/domain/pricing';
import { bagFillGrams } from '@shared/domain/units';
import { greenBagSizes, type GreenBagSize } from '@shared/domain/vocabulary';
import { maxBagsPerLine } from '@shared/schemas/checkout';
import type { LotDetail } from '@shared/schemas/lots';
import { Button } from '@/components/ui/button';
import { controlStyles } from '@/components/ui/control-styles';
import { FormAlert } from '@/components/ui/form-alert';
import { paths } from '@/config/paths';
import { useShopMoney } from '@/lib/shop-currency';
import { bagSizeLabel, formatWeight, type WeightUnit } from '../utils/weight-unit';

type LotPurchasePanelProps = {
  lot: LotDetail;
  size: GreenBagSize;
  onSizeChange: (size: GreenBagSize) => void;
  unit: WeightUnit;
  /** Puts the bags in the cart; false when the cart cannot take another line. */
  onAddToCart: (size: GreenBagSize, quantity: number) => boolean;
};

/** Per-bag price for `quantity` bags of one size, quantity breaks applied to their fill weight. */
function bagPrice(lot: LotDetail, size: GreenBagSize, quantity: number) {
  const pricePerKgCents = pricePerKgFor(bagFillGrams(size) * quantity, lot);
  return { pricePerKgCents, bagCents: greenBagPrice(size, pricePerKgCents) };
}

/** The size picker, quantity and "Add to cart" for one lot. */
export function LotPurchasePanel({ lot, size, onSizeChange, unit, onAddToCart }: LotPurchasePanelProps) {
  const { money, pricePerKg } = useShopMoney();
  const quantityId = useId();
  const [quantityText, setQuantityText] = useState('1');
  const [message, setMessage] = useState<{ tone: 'status' | 'alert'; text: string }>();

  const quantity = Number(quantityText);
  const quantityValid = Number.isInteger(quantity) && quantity >= 1 && quantity <= maxBagsPerLine;
  const wanted = quantityValid ? quantity : 1;
  const neededGrams = bagFillGrams(size) * wanted;
  const outOfStock = lot.stockGrams < bagFillGrams('8oz');
  const notEnough = !outOfStock && neededGrams > lot.stockGrams;
  const { pricePerKgCents, bagCents } = bagPrice(lot, size, wanted);

  const add = () => {
    if (!quantityValid || notEnough || outOfStock) return;
    const added = onAddToCart(size, quantity);
    setMessage(
      added
        ? { tone: 'status', text: `Added ${quantity} × ${bagSizeLabel(size)} to your cart.` }
        : { tone: 'alert', text: 'Your cart holds as many lines as one order takes. Check out first, or remove a line.' },
    );
  };

  return (
    <section aria-labelledby="buy-heading" className="rounded-card border border-rule bg-sheet p-5 shadow-card">
      <h2 id="buy-heading" className="text-h3">
        Buy green
      </h2>
      <fieldset className="mt-3">
        <legend className="text-small font-semibold">Bag size</legend>
        <div className="mt-2 grid grid-cols-2 gap-2 sm:grid-cols-4">
          {greenBagSizes.map((each) => {
            const fill = bagFillGrams(each);
            const price = bagPrice(lot, each, 1);
            const disabled = fill > lot.stockGrams;
            return (
              <label
                key={each}
                className={clsx(
                  'flex cursor-pointer flex-col rounded-control border px-3 py-2 has-[:focus-visible]:outline-3 has-[:focus-visible]:outline-focus',
                  each === size ? 'border-leaf bg-leaf-wash' : 'border-rule-strong',
                  disabled && 'cursor-not-allowed opacity-60',
                )}
              >
                <input
                  type="radio"
                  name="bag-size"
                  value={each}
                  checked={each === size}
                  onChange={() => {
                    onSizeChange(each);
                    setMessage(undefined);
                  }}
                  className="sr-only"
                />
                <span className="font-semibold">{bagSizeLabel(each)}</span>
                <span className="text-caption text-ink-muted">fills {formatWeight(fill, unit)}</span>
                <span className="font-semibold">{money(price.bagCents)}</span>
              </label>
            );
          })}
        </div>
      </fieldset>

      <div className="mt-4 flex flex-wrap items-end gap-4">
        <div className="w-28">
          <label htmlFor={quantityId} className="block text-small font-semibold">
            Bags
          </label>
          <input
            id={quantityId}
            type="number"
            inputMode="numeric"
            min={1}
            max={maxBagsPerLine}
            step={1}
            value={quantityText}
            aria-invalid={quantityValid ? undefined : true}
            aria-describedby={quantityValid ? undefined : `${quantityId}-error`}
            onChange={(event) => {
              setQuantityText(event.target.value);
              setMessage(undefined);
            }}
            className={clsx(controlStyles, 'mt-1', !quantityValid && 'border-alert')}
          />
        </div>
        <p className="pb-2" aria-live="polite">
          <span className="font-semibold">{money(bagCents * wanted)}</span> <span className="text-small text-ink-muted">({pricePerKg(pricePerKgCents)})</span>
        </p>
      </div>
      {!quantityValid ? (
        <p id={`${quantityId}-error`} className="mt-1 text-small font-semibold text-alert">
          Enter a whole number of bags from 1 to {maxBagsPerLine}.
        </p>
      ) : null}
      {notEnough ? (
        <p className="mt-2 text-small font-semibold text-alert">
          Only {formatWeight(lot.stockGrams, unit)} left: not enough for {wanted} × {bagSizeLabel(size)}.
        </p>
      ) : null}

      <Button className="mt-4 w-full sm:w-auto" onClick={add} disabled={outOfStock || notEnough || !quantityValid}>
        {outOfStock ? 'Out of stock' : 'Add to cart'}
      </Button>
      {message ? (
        <div className="mt-3">
          <FormAlert tone={message.tone}>
            {message.text}{' '}
            {message.tone === 'status' ? (
              <Link to={paths.cart.getHref()} className="font-semibold text-leaf underline">
                View your cart
              </Link>
            ) : null}
          </FormAlert>
        </div>
      ) : null}
    </section>
  );
}
