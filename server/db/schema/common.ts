import { timestamp } from 'drizzle-orm/pg-core';

/** A postal address as copied onto an order or a subscription (a snapshot: later edits to the
 *  customer's address book do not change where a paid order goes). */
export type AddressSnapshot = {
  name: string;
  line1: string;
  line2?: string | null;
  city: string;
  region: string;
  postalCode: string;
  country: string;
};

/** createdAt / updatedAt pair used by most tables (instants, UTC, `timestamp with time zone`). */
export const timestamps = () => ({
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { withTimezone: true })
    .notNull()
    .defaultNow()
    .$onUpdate(() => new Date()),
});

export const instant = (name: string) => timestamp(name, { withTimezone: true });
