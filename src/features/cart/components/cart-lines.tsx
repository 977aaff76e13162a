import { Trash2 } from 'lucide-react';
import { useId, useMemo } from 'react';
import { Link } from 'react-router-dom';
import { formatMoney } from '@shared/domain/money';
import { bagFillGrams, bagSizeDeclarations } from '@shared/domain/units';
import { maxBagsPerLine } from '@shared/schemas/checkout';
import { controlStyles } from '@/components/ui/control-styles';
import { paths } from '@/config/paths';
import { formatGrams } from '@/lib/format';
import { useShipping } from '../api/get-shipping';
import { useCart } from '../hooks/use-cart';
import { quoteCart } from '../utils/quote-cart';
import type { CartLine } from '../stores/cart-store';

function sizeLabel(line: CartLine): string {
  const { amount, unit } = bagSizeDeclarations[line.size];
  return `${amount} ${unit} (${formatGrams(bagFillGrams(line.size))})`;
}

function QuantityInput({ line }: { line: CartLine }) {
  const id = useId();
  const { setQuantity } = useCart();
  return (
    <div className="w-24">
      <label htmlFor={id} className="block text-caption font-semibold">
        Bags
      </label>
      <input
        id={id}
        type="number"
        inputMode="numeric"
        min={1}
        max={maxBagsPerLine}
        step={1}
        value={line.quantity}
        onChange={(event) => {
          const quantity = Number(event.target.value);
          if (Number.isFinite(quantity) && quantity >= 1) setQuantity(line, quantity);
        }}
        className={controlStyles}
      />
    </div>
  );
}

type CartLinesProps = {
  /** Quantities and removal can be changed here (the cart page), or only read (checkout). */
  editable: boolean;
  /** Why a line cannot be bought, by its index (from the server). */
  lineErrors?: Readonly<Record<number, string>>;
};

/** The cart's bags with their prices, and the order's totals from the trade engine. */
export function CartLines({ editable, lineErrors = {} }: CartLinesProps) {
  const { lines, remove } = useCart();
  const shippingQuery = useShipping();
  const rules = shippingQuery.data;
  // Priced with the bands the shop publishes, so in the currency published with them.
  const money = (minor: number) => (rules ? formatMoney(minor, rules.currency) : '');
  // The parcel search can take a noticeable moment on a very large cart: price once per change.
  const priced = useMemo(() => (rules ? quoteCart(lines, rules) : undefined), [lines, rules]);
  const quote = priced?.ok ? priced.quote : undefined;
  const itemLines = quote?.lines.filter((line) => line.kind === 'item') ?? [];
  const parcels = quote?.shipping.parcels ?? [];

  return (
    <div>
      <ul aria-label="Bags in your cart" className="divide-y divide-rule rounded-card border border-rule bg-sheet">
        {lines.map((line, index) => {
          const linePrice = itemLines[index];
          const error = lineErrors[index];
          const name = `${line.lotName}, ${bagSizeDeclarations[line.size].amount} ${bagSizeDeclarations[line.size].unit}`;
          return (
            <li key={`${line.lotCode}|${line.size}`} aria-label={name} className="flex flex-wrap items-end gap-x-4 gap-y-2 p-4">
              <div className="min-w-40 flex-1">
                <Link to={paths.lot.getHref(line.lotCode)} className="font-semibold text-ink underline">
                  {line.lotName}
                </Link>
                <p className="text-small text-ink-muted">
                  {sizeLabel(line)} · lot {line.lotCode}
                  {linePrice ? ` · ${money(linePrice.unitCents)} a bag` : ''}
                </p>
              </div>
              {editable ? <QuantityInput line={line} /> : <p className="text-small">× {line.quantity}</p>}
              <p className="w-24 text-right font-semibold">{linePrice ? money(linePrice.amountCents) : ''}</p>
              {editable ? (
                <button
                  type="button"
                  onClick={() => remove(line)}
                  aria-label={`Remove ${name}`}
                  className="inline-flex min-h-11 min-w-11 items-center justify-center rounded-control text-ink hover:bg-paper-shade"
                >
                  <Trash2 aria-hidden="true" className="size-5" />
                </button>
              ) : null}
              {error ? (
                <p role="alert" className="w-full text-small font-semibold text-alert">
                  {error}
                </p>
              ) : null}
            </li>
          );
        })}
      </ul>

      {priced && !priced.ok ? (
        <p role="alert" className="mt-4 text-small font-semibold text-alert">
          {priced.message}
        </p>
      ) : null}
      {shippingQuery.isError ? (
        <p role="alert" className="mt-4 text-small font-semibold text-alert">
          Shipping could not be priced just now; checkout will show it.
        </p>
      ) : null}
      {quote ? (
        <dl className="mt-4 ml-auto grid max-w-xs grid-cols-[1fr_auto] gap-x-6 gap-y-1">
          <dt>Bags</dt>
          <dd className="text-right">{money(quote.subtotalCents)}</dd>
          <dt>{parcels.length > 1 ? `Shipping, ${parcels.length} parcels` : 'Shipping'}</dt>
          <dd className="text-right">{money(quote.shippingCents)}</dd>
          {parcels.length > 1
            ? parcels.map((parcel, index) => (
                <div key={index} className="col-span-2 grid grid-cols-subgrid text-small text-ink-muted">
                  <dt className="pl-3">
                    Parcel {index + 1}: {parcel.bags.reduce((sum, bag) => sum + bag.quantity, 0)} bags, {formatGrams(parcel.grams)}
                  </dt>
                  <dd className="text-right">{money(parcel.cents)}</dd>
                </div>
              ))
            : null}
          <dt className="border-t border-rule pt-1 font-semibold">Total</dt>
          <dd className="border-t border-rule pt-1 text-right font-semibold">{money(quote.totalCents)}</dd>
        </dl>
      ) : shippingQuery.isPending ? (
        <p className="mt-4 text-right text-small text-ink-muted">Pricing shipping…</p>
      ) : null}
    </div>
  );
}
