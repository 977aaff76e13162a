import { sql } from 'drizzle-orm';
import { orderItems, orders, rotationPicks } from './schema/index';

/**
 * The lot an order line is filled from: its own, or for a Roaster's Rotation line the lot picked
 * for the order's roast day (null until staff pick one). For queries that already join `orders`
 * to `order_items`: `.leftJoin(lots, eq(lots.id, orderLineLotId))`.
 */
export const orderLineLotId = sql`coalesce(${orderItems.lotId}, (select ${rotationPicks.lotId} from ${rotationPicks} where ${rotationPicks.roastDate} = ${orders.roastDate}))`;
