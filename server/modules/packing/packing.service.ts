import { labelStocks, type LabelStockId } from '@shared/domain/label-stock';
import { findCarrier, trackingUrl } from '@shared/domain/carriers';
import { bagNetWeightLabel } from '@shared/domain/labels';
import { BagTooHeavyForShipping, planShipping, type ShippingSettings } from '@shared/domain/parcel-packing';
import { arrivalDate } from '@shared/domain/roast-schedule';
import { localDateOf } from '@shared/domain/shop-time';
import { roastLevelLabels, type OrderStatus } from '@shared/domain/vocabulary';
import type { BulkShipBody, PackBag, PackListResponse, PackOrder } from '@shared/schemas/packing';
import { AppError } from '../../lib/app-error';
import type { Clock } from '../../lib/clock';
import { queueEmail } from '../outbox';
import { allocateBags, type LineToFill, type Shortfall } from './bag-allocation';
import { renderLabelsPdf } from './labels-pdf';
import type { PackingRepo, PackingTransaction, PackListRow } from './packing.repo';

/** Statuses an order may be packed from; a roasted order still 'paid' is proven roasted by its batches. */
const packableStatuses: readonly OrderStatus[] = ['paid', 'roasted'];

/** One entry per bag, each carrying the batch it was filled from once the order is packed. */
function bagsOf(order: PackListRow): PackBag[] {
  const bags: PackBag[] = [];
  for (const line of order.lines) {
    const batchIds = line.allocations.flatMap((allocation) => Array<string>(allocation.bags).fill(allocation.batchId));
    const roasted = order.kind === 'roasted';
    for (let n = 0; n < line.quantity; n++) {
      bags.push({
        orderItemId: line.id,
        bagNumber: bags.length + 1,
        coffee: line.coffee,
        lotCode: line.lotCode,
        roastLevel: line.roastLevel,
        grind: line.grind,
        size: line.size,
        netGrams: line.fillGrams,
        netLabel: bagNetWeightLabel(line.size),
        roastDate: roasted ? order.roastDate : null,
        readyFrom: roasted ? order.readyFrom : null,
        bestBefore: roasted ? order.bestBefore : null,
        batchId: batchIds[n] ?? null,
      });
    }
  }
  return bags;
}

/**
 * Which bags go in which parcel: the same plan that priced the order's shipping (whole bags,
 * cheapest packing within the owner's bands today). A bag too heavy for the bands since they
 * changed gets no plan, and a note saying so, rather than a broken Pack List.
 */
function parcelsOf(bags: readonly PackBag[], shipping: ShippingSettings): Pick<PackOrder, 'parcels' | 'parcelNote'> {
  const items = new Map<string, { fillGrams: number; bagNumbers: number[] }>();
  for (const bag of bags) {
    const item = items.get(bag.orderItemId) ?? { fillGrams: bag.netGrams, bagNumbers: [] };
    item.bagNumbers.push(bag.bagNumber);
    items.set(bag.orderItemId, item);
  }
  try {
    const plan = planShipping(
      [...items].map(([key, item]) => ({ key, fillGrams: item.fillGrams, quantity: item.bagNumbers.length })),
      shipping,
    );
    const parcels = plan.parcels.map((parcel, index) => ({
      parcelNumber: index + 1,
      bagNumbers: parcel.bags.flatMap((bag) => items.get(bag.key)!.bagNumbers.splice(0, bag.quantity)).sort((a, b) => a - b),
      grams: parcel.grams,
      bandMaxGrams: parcel.bandMaxGrams,
      cents: parcel.cents,
    }));
    return { parcels, parcelNote: null };
  } catch (error) {
    if (!(error instanceof BagTooHeavyForShipping)) throw error;
    return {
      parcels: [],
      parcelNote: `A bag weighs ${error.parcelGrams.toLocaleString('en-US')} g in its box, over the heaviest shipping band (${error.heaviestBandGrams.toLocaleString('en-US')} g): pack it by hand.`,
    };
  }
}

function packOrderOf(order: PackListRow, shipping: ShippingSettings): PackOrder {
  const bags = bagsOf(order);
  return {
    orderId: order.id,
    customerName: order.customerName,
    kind: order.kind,
    status: order.status,
    shipDate: order.shipDate,
    packedAt: order.packedAt?.toISOString() ?? null,
    shippedAt: order.shippedAt?.toISOString() ?? null,
    carrier: order.carrier,
    trackingNumber: order.trackingNumber,
    bags,
    ...parcelsOf(bags, shipping),
  };
}

const grams = (value: number) => `${value.toLocaleString('en-US')} g`;

function shortfallMessage(shortfalls: Shortfall[], lotCodes: Map<string | null, string | null>, roastDate: string): string {
  const parts = shortfalls.map(
    (short) =>
      `${lotCodes.get(short.lotId) ?? 'the lot'} at ${roastLevelLabels[short.roastLevel].toLowerCase()} needs ${grams(short.neededGrams)} in whole bags and its batches have ${grams(short.freeGrams)} left`,
  );
  return `The batches recorded for ${roastDate} cannot fill this order: ${parts.join('; ')}. Record the batch first.`;
}

export interface PackingDeps {
  repo: PackingRepo;
  clock: Clock;
}

export function createPackingService({ repo, clock }: PackingDeps) {
  async function currentOrder(orderId: string): Promise<PackOrder> {
    const [order, shipping] = await Promise.all([repo.packOrder(orderId), repo.shippingSettings()]);
    if (!order) throw AppError.notFound('Order');
    return packOrderOf(order, shipping);
  }

  /** Fills each roasted bag from the roast day's batches of its lot and level, or refuses with what is short. */
  async function allocateRoastedBags(tx: PackingTransaction, order: { id: string; roastDate: string | null }) {
    const lines = await tx.lines(order.id);
    if (!order.roastDate) throw AppError.conflict('no_roast_date', 'This order has no roast date, so no batch can fill it.');
    // Bags already filled (recorded with their batch before packing) are not filled twice.
    const filled = await tx.filledBags(order.id);
    const unfilled = lines.filter((line) => (filled.get(line.id) ?? 0) < line.quantity);
    const toFill: LineToFill[] = unfilled.map((line) => {
      if (!line.lotId) {
        throw AppError.conflict('rotation_not_picked', `No lot is picked for Roaster's Rotation on ${order.roastDate}. Pick it, roast it, then pack.`);
      }
      if (!line.roastLevel) throw new Error(`roasted order line ${line.id} has no roast level`);
      return {
        orderItemId: line.id,
        lotId: line.lotId,
        roastLevel: line.roastLevel,
        bags: line.quantity - (filled.get(line.id) ?? 0),
        fillGrams: line.fillGrams,
      };
    });
    const lotLevels = [...new Map(toFill.map((line) => [`${line.lotId}|${line.roastLevel}`, { lotId: line.lotId, roastLevel: line.roastLevel }])).values()];
    const plan = allocateBags(toFill, await tx.lockBatchRoom(order.roastDate, lotLevels));
    if (!plan.ok) {
      const lotCodes = new Map(lines.map((line) => [line.lotId, line.lotCode]));
      throw AppError.conflict('batches_short', shortfallMessage(plan.shortfalls, lotCodes, order.roastDate));
    }
    await tx.insertAllocations(order.id, plan.allocations);
    return lines;
  }

  /**
   * Marks a packed order shipped and queues the shipped e-mail with the tracking number (and, for
   * roasted coffee, the ready-from date), in the caller's transaction. The same carrier and number
   * again is a no-op; different ones are refused.
   */
  async function shipInTransaction(tx: PackingTransaction, orderId: string, { carrier, trackingNumber }: { carrier: string; trackingNumber: string }) {
    const order = await tx.lockOrder(orderId);
    if (!order) throw AppError.notFound('Order');
    if (order.status === 'shipped') {
      if (order.carrier === carrier && order.trackingNumber === trackingNumber) return;
      throw AppError.conflict('already_shipped', `This order already shipped with ${order.carrier}, tracking number ${order.trackingNumber}.`);
    }
    if (order.status !== 'packed') {
      throw AppError.conflict('not_packed', `Mark the order packed before shipping it (it is ${order.status.replace('_', ' ')}).`);
    }
    const shippedAt = clock.now();
    await tx.markShipped(order.id, { carrier, trackingNumber, shippedAt });
    await tx.setDeliveryStatus(order.id, 'shipped', ['scheduled', 'roasted']);
    const roasted = order.kind === 'roasted';
    // When it should land, counted from the day it really left, and whether it is ready by then.
    const settings = await tx.shopSettings();
    const expectedArrival = arrivalDate(localDateOf(shippedAt, settings.timeZone), settings.transitDays);
    // A carrier the shop has listed gets its tracking page; any other, the number alone.
    const knownCarrier = findCarrier(settings.carriers, carrier);
    await queueEmail(tx.tx, {
      template: 'shipped',
      to: order.customerEmail,
      dedupeKey: `shipped:${order.id}`,
      payload: {
        name: order.customerName,
        orderId: order.id,
        kind: order.kind,
        carrier: knownCarrier?.name ?? carrier,
        trackingNumber,
        ...(knownCarrier ? { trackingUrl: trackingUrl(knownCarrier.trackingUrlTemplate, trackingNumber) } : {}),
        expectedArrival,
        ...(roasted && order.readyFrom ? { readyFrom: order.readyFrom, readyOnArrival: expectedArrival >= order.readyFrom } : {}),
        ...(roasted && order.bestBefore ? { bestBefore: order.bestBefore } : {}),
      },
    });
  }

  return {
    async packList(date: string): Promise<PackListResponse> {
      const [orders, shipping] = await Promise.all([repo.packList(date), repo.shippingSettings()]);
      return { date, orders: orders.map((order) => packOrderOf(order, shipping)) };
    },

    /**
     * One label per bag of the day's Pack List, as a PDF on the chosen label stock. Refused until the
     * shop's place of business is set: a packed food label must name where it was packed.
     */
    async labelsPdf(date: string, stock: LabelStockId): Promise<Buffer> {
      const [shopName, settings, orders] = await Promise.all([repo.shopName(), repo.shopSettings(), repo.packList(date)]);
      if (!settings.placeOfBusiness) {
        throw AppError.conflict('place_of_business_missing', 'Bag labels print the shop’s postal address: the owner enters it in Settings first.');
      }
      return renderLabelsPdf({
        maker: { shopName, placeOfBusiness: settings.placeOfBusiness },
        date,
        orders: orders.map((order) => packOrderOf(order, settings.shipping)),
        stock: labelStocks[stock],
      });
    },

    /**
     * Marks an order packed: roasted bags are allocated to batches (in the same transaction, under
     * row locks) and the customer gets the roasted e-mail. Packing a packed order changes nothing.
     */
    async pack(orderId: string): Promise<PackOrder> {
      await repo.transaction(async (tx) => {
        const order = await tx.lockOrder(orderId);
        if (!order) throw AppError.notFound('Order');
        if (order.status === 'packed' || order.status === 'shipped') return;
        if (!packableStatuses.includes(order.status)) {
          throw AppError.conflict('not_packable', `An order that is ${order.status.replace('_', ' ')} cannot be packed.`);
        }
        if (order.kind === 'roasted') {
          const lines = await allocateRoastedBags(tx, order);
          await tx.setDeliveryStatus(order.id, 'roasted', ['scheduled']);
          await queueEmail(tx.tx, {
            template: 'roasted',
            to: order.customerEmail,
            dedupeKey: `roasted:${order.id}`,
            payload: {
              name: order.customerName,
              orderId: order.id,
              roastDate: order.roastDate!,
              lines: lines.map((line) => ({
                description: line.coffee,
                size: line.size,
                quantity: line.quantity,
                ...(line.roastLevel ? { roastLevel: line.roastLevel } : {}),
                ...(line.grind ? { grind: line.grind } : {}),
              })),
              ...(order.shipDate ? { shipDate: order.shipDate } : {}),
              ...(order.readyFrom ? { readyFrom: order.readyFrom } : {}),
            },
          });
        }
        await tx.markPacked(order.id, clock.now());
      });
      return currentOrder(orderId);
    },

    /** Marks one packed order shipped (see shipInTransaction). */
    async ship(orderId: string, shipment: { carrier: string; trackingNumber: string }): Promise<PackOrder> {
      await repo.transaction((tx) => shipInTransaction(tx, orderId, shipment));
      return currentOrder(orderId);
    },

    /**
     * "Mark all packed orders shipped": every order named, with one carrier, in one transaction
     * (all ship or none does). Each must be on this day's Pack List.
     */
    async shipDay(date: string, { carrier, shipments }: BulkShipBody): Promise<PackListResponse> {
      await repo.transaction(async (tx) => {
        for (const { orderId, trackingNumber } of shipments) {
          const order = await tx.lockOrder(orderId);
          if (!order || order.shipDate !== date) {
            throw AppError.badRequest('An order is not on this day’s Pack List.', { shipments: `Order ${orderId} does not ship on ${date}.` });
          }
          await shipInTransaction(tx, orderId, { carrier, trackingNumber });
        }
      });
      return this.packList(date);
    },
  };
}

export type PackingService = ReturnType<typeof createPackingService>;
