import { pgEnum } from 'drizzle-orm/pg-core';
import {
  bagSizes,
  brewMethods,
  deliveryStatuses,
  grinds,
  homeRoastDevices,
  orderKinds,
  orderStatuses,
  processes,
  roastLevels,
  roles,
  stockMovementReasons,
  subscriptionStatuses,
} from '../../../shared/domain/vocabulary';

// PostgreSQL enums built from the shared vocabulary, so the database, the API schemas and the UI
// can never disagree about a value. Adding a value later needs a migration (ALTER TYPE … ADD VALUE).

export const roleEnum = pgEnum('role', roles);
export const roastLevelEnum = pgEnum('roast_level', roastLevels);
export const processEnum = pgEnum('process', processes);
export const bagSizeEnum = pgEnum('bag_size', bagSizes);
export const brewMethodEnum = pgEnum('brew_method', brewMethods);
export const grindEnum = pgEnum('grind', grinds);
export const orderKindEnum = pgEnum('order_kind', orderKinds);
export const orderStatusEnum = pgEnum('order_status', orderStatuses);
export const subscriptionStatusEnum = pgEnum('subscription_status', subscriptionStatuses);
export const deliveryStatusEnum = pgEnum('delivery_status', deliveryStatuses);
export const homeRoastDeviceEnum = pgEnum('home_roast_device', homeRoastDevices);
export const stockMovementReasonEnum = pgEnum('stock_movement_reason', stockMovementReasons);

export const uploadKinds = ['photo', 'spec_sheet'] as const;
export type UploadKind = (typeof uploadKinds)[number];
export const uploadKindEnum = pgEnum('upload_kind', uploadKinds);

export const outboxStatuses = ['pending', 'sending', 'sent', 'failed'] as const;
export type OutboxStatus = (typeof outboxStatuses)[number];
export const outboxStatusEnum = pgEnum('outbox_status', outboxStatuses);
