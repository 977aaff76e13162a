import { quoteGreenOrder, type GreenLotPrice } from '@shared/domain/pricing';
import { bagFillGrams } from '@shared/domain/units';
import type { CheckoutUrlResponse, GreenCheckoutRequest, GreenCheckoutResponse } from '@shared/schemas/checkout';
import type { Clock } from '../../lib/clock';
import { AppError } from '../../lib/app-error';
import type { SessionUser } from '../../middleware/require-role';
import type { AddressBook } from '../account';
import type { PaymentsService } from '../payments';
import { assertBagsShip } from '../shipping';
import { StockShortfall, type CheckoutRepo, type ShortLot } from './checkout.repo';

export interface CheckoutServiceDeps {
  repo: CheckoutRepo;
  payments: Pick<PaymentsService, 'createCheckoutForOrder'>;
  clock: Clock;
  addressBook: AddressBook;
}

const grams = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

/** One reason per cart line of a short lot, on its quantity, saying what is left and how many such bags that fills. */
function shortOfStock(items: GreenCheckoutRequest['items'], shortLots: ShortLot[]): AppError {
  const stockByCode = new Map(shortLots.map((lot) => [lot.lotCode, lot.stockGrams]));
  const fields: Record<string, string> = {};
  items.forEach((item, index) => {
    const stockGrams = stockByCode.get(item.lotCode);
    if (stockGrams === undefined) return;
    const bags = Math.floor(stockGrams / bagFillGrams(item.size));
    const fills = bags === 0 ? 'not enough for one bag of this size' : `enough for ${bags} ${bags === 1 ? 'bag' : 'bags'} of this size`;
    fields[`items.${index}.quantity`] = `Only ${grams.format(stockGrams)} g in stock, ${fills}.`;
  });
  const codes = shortLots.map((lot) => lot.lotCode).join(', ');
  return new AppError(
    409,
    'insufficient_stock',
    `There is not enough of ${shortLots.length === 1 ? 'lot' : 'lots'} ${codes} left for this order. Nothing was reserved or charged; lower the quantity or choose another lot.`,
    fields,
  );
}

export function createCheckoutService({ repo, payments, clock, addressBook }: CheckoutServiceDeps) {
  /** Prices the cart and places its order with the stock reserved; the id of the order (an existing one under the same key). */
  async function placeOrder(user: SessionUser, request: GreenCheckoutRequest, checkoutKey: string | undefined): Promise<string> {
    const codes = [...new Set(request.items.map((item) => item.lotCode))];
    const lotsForSale = await repo.lotsForSale(codes);
    const byCode = new Map(lotsForSale.map((lot) => [lot.code, lot]));
    const fields: Record<string, string> = {};
    request.items.forEach((item, index) => {
      if (!byCode.has(item.lotCode)) fields[`items.${index}.lotCode`] = `There is no lot ${item.lotCode} for sale.`;
    });
    if (Object.keys(fields).length > 0) throw AppError.badRequest('Some lots in the cart are not for sale.', fields);

    const prices: Record<string, GreenLotPrice> = Object.fromEntries(
      lotsForSale.map((lot) => [lot.code, { pricePerKgCents: lot.pricePerKgCents, priceBreaks: lot.priceBreaks }]),
    );
    const shipping = await repo.shippingSettings();
    assertBagsShip(
      request.items.map((item, index) => ({ field: `items.${index}.size`, size: item.size })),
      shipping,
    );
    const quote = quoteGreenOrder(request.items, prices, { shipping });
    const itemLines = quote.lines.filter((line) => line.kind === 'item');
    const items = request.items.map((item, index) => {
      const line = itemLines[index]!;
      return {
        lotId: byCode.get(item.lotCode)!.id,
        size: item.size,
        quantity: item.quantity,
        fillGrams: bagFillGrams(item.size),
        unitPriceCents: line.unitCents,
        lineTotalCents: line.amountCents,
      };
    });
    const gramsPerLot = new Map<string, number>();
    for (const item of request.items) {
      gramsPerLot.set(item.lotCode, (gramsPerLot.get(item.lotCode) ?? 0) + bagFillGrams(item.size) * item.quantity);
    }

    try {
      const { orderId } = await repo.placeGreenOrder({
        userId: user.id,
        subtotalCents: quote.subtotalCents,
        shippingCents: quote.shippingCents,
        totalCents: quote.subtotalCents + quote.shippingCents,
        shippingAddress: request.shippingAddress,
        ...(checkoutKey ? { checkoutKey } : {}),
        items,
        reservations: [...gramsPerLot].map(([lotCode, grams]) => ({ lotId: byCode.get(lotCode)!.id, lotCode, grams })),
      });
      return orderId;
    } catch (error) {
      if (error instanceof StockShortfall) throw shortOfStock(request.items, error.shortLots);
      throw error;
    }
  }

  async function ownUnpaidOrder(user: SessionUser, orderId: string) {
    const order = await repo.ownOrder(user.id, orderId);
    if (!order) throw AppError.notFound('Order');
    if (order.kind !== 'green' || order.status !== 'pending_payment') throw AppError.conflict('order_not_payable', 'This order is not waiting for payment.');
    return order;
  }

  return {
    /**
     * "Pay now" on an order left awaiting payment: the same order and, while it is open, the same
     * payment page; nothing is reserved again. Abandoning that page comes back to the order.
     */
    async resumePayment(user: SessionUser, orderId: string): Promise<CheckoutUrlResponse> {
      await ownUnpaidOrder(user, orderId);
      const { checkoutUrl } = await payments.createCheckoutForOrder(orderId, {
        successPath: `/orders/${orderId}?checkout=complete`,
        cancelPath: `/orders/${orderId}?checkout=cancelled`,
      });
      return { checkoutUrl };
    },

    /** "Discard": the unpaid order is cancelled, its stock goes back, and it leaves the customer's history. */
    async discard(user: SessionUser, orderId: string): Promise<void> {
      await ownUnpaidOrder(user, orderId);
      if (!(await repo.discardUnpaidOrder(orderId, clock.now()))) {
        throw AppError.conflict('order_not_payable', 'This order is not waiting for payment.');
      }
    },

    /**
     * Prices the cart with the trade engine, places the order with its stock reserved (one
     * transaction), then opens the payment page. If the page cannot be opened, the order is
     * cancelled and its stock put back before the error goes on; if even that fails (the database
     * went away), the unpaid-orders job cancels it after its grace period.
     *
     * `checkoutKey` is the request's Idempotency-Key: a retry with the same key (a lost answer, a
     * 503) resumes the order it placed, reserving nothing again, and gets the same payment page
     * (Stripe's own idempotency replays the session made for it). Once that order is cancelled the
     * key places a new one.
     */
    async checkoutGreen(user: SessionUser, request: GreenCheckoutRequest, checkoutKey?: string): Promise<GreenCheckoutResponse> {
      const resumed = checkoutKey ? await repo.orderForCheckoutKey(user.id, checkoutKey) : undefined;
      const orderId = resumed ?? (await placeOrder(user, request, checkoutKey));
      if (request.saveAddress) await addressBook.keep(user.id, request.shippingAddress);
      try {
        const { checkoutUrl } = await payments.createCheckoutForOrder(orderId);
        return { orderId, checkoutUrl };
      } catch (error) {
        // A database that is down here is down for the cancel too; the original error is the one to answer.
        await repo.cancelUnpaidOrder(orderId, clock.now(), 'payment page could not be opened').catch(() => undefined);
        throw error;
      }
    },
  };
}

export type CheckoutService = ReturnType<typeof createCheckoutService>;
