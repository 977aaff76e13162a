import { timestamp } from 'drizzle-orm/pg-core';
import type { StoredPostalAddress } from '../../../shared/schemas/address';

/** A postal address as copied onto an order or a subscription: the one shared model. */
export type AddressSnapshot = StoredPostalAddress;

/** createdAt / updatedAt pair used by most tables (instants, UTC, `timestamp with time zone`). */
export const timestamps = () => ({
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
});

export const instant = (name: string) => timestamp(name, { withTimezone: true });
