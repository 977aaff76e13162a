import type { BatchTrace, OrderTrace } from '@shared/schemas/packing';
import { AppError } from '../../lib/app-error';
import type { TraceRepo } from './trace.repo';

export function createTraceService(repo: TraceRepo) {
  return {
    /** An order → the batches and lots its bags came from; bags no batch has filled yet are listed apart. */
    async order(orderId: string): Promise<OrderTrace> {
      const order = await repo.order(orderId);
      if (!order) throw AppError.notFound('Order');
      const [lines, allocations] = await Promise.all([repo.orderLines(orderId), repo.orderAllocations(orderId)]);
      const bags: OrderTrace['bags'] = [];
      for (const line of lines) {
        let filled = 0;
        for (const allocation of allocations.filter((candidate) => candidate.orderItemId === line.id)) {
          const { batchId, lotCode, lotName, roastLevel, roastDate, grams } = allocation;
          bags.push({ batchId, lotCode, lotName, roastLevel, roastDate, size: line.size, bags: allocation.bags, grams });
          filled += allocation.bags;
        }
        const unfilled = line.quantity - filled;
        if (unfilled > 0) {
          bags.push({
            batchId: null,
            lotCode: line.lotCode,
            lotName: line.lotName,
            roastLevel: line.roastLevel,
            roastDate: null,
            size: line.size,
            bags: unfilled,
            grams: unfilled * line.fillGrams,
          });
        }
      }
      return { order: { ...order, shippedAt: order.shippedAt?.toISOString() ?? null }, bags };
    },

    /** A batch → every order it went into, with the customer to contact in a recall. */
    async batch(batchId: string): Promise<BatchTrace> {
      const batch = await repo.batch(batchId);
      if (!batch) throw AppError.notFound('Batch');
      const orders = await repo.batchOrders(batchId);
      return { batch, orders: orders.map((order) => ({ ...order, shippedAt: order.shippedAt?.toISOString() ?? null })) };
    },
  };
}

export type TraceService = ReturnType<typeof createTraceService>;
