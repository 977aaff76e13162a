// The invented address the tests ship to, and saved addresses of test accounts.
import { addresses, type AddressSnapshot } from '../../server/db/schema/index';
import { getTestDb } from '../setup/test-db';
import type { TestUser } from './users';

/** The address as the checkout and subscription forms send it. */
export const shipTo = { name: 'Robin Invented', line1: '4 Larkspur Lane', city: 'Wrenfield', region: 'CO', postalCode: '81640' };

/** The same address as an order or a subscription keeps it. */
export const shippingAddress: AddressSnapshot = { ...shipTo, line2: null, country: 'US' };

/** A saved address of `owner`'s, under the owner's name. */
export async function createAddress(owner: TestUser) {
  const [row] = await getTestDb()
    .insert(addresses)
    .values({ userId: owner.id, ...shipTo, name: owner.name })
    .returning({ id: addresses.id });
  return row!;
}
