// The invented team and customers: one user each, and a default street address for each customer.
import type * as schema from '../schema/index';
import type { AddressSnapshot } from '../schema/index';
import { DEMO_CUSTOMER_EMAIL, demoCustomers, demoStreets, demoTeam, demoTowns } from './demo-people';
import type { Random } from './random';
import type { Insert, SeedClock } from './scenario-values';

export type DemoAccounts = {
  users: Insert<typeof schema.users>[];
  addresses: Insert<typeof schema.addresses>[];
  ownerId: string;
  roasterId: string;
  packerId: string;
  /** Every customer, the demo customer first. */
  customerIds: string[];
  demoCustomerId: string;
  emailOf(userId: string): string;
  nameOf(userId: string): string;
  addressOf(userId: string): AddressSnapshot;
};

export function demoAccounts(rng: Random, clock: SeedClock, passwordHash: string): DemoAccounts {
  const users: Insert<typeof schema.users>[] = [];
  const addresses: Insert<typeof schema.addresses>[] = [];
  const userIdByEmail = new Map<string, string>();
  const addressByUser = new Map<string, AddressSnapshot>();
  for (const person of [...demoTeam, ...demoCustomers]) {
    const id = rng.uuid();
    const createdAt = clock.daysAgo(person.joinedDaysAgo, rng.int(0, 600));
    users.push({ id, email: person.email, name: person.name, passwordHash, role: person.role, createdAt, updatedAt: createdAt });
    userIdByEmail.set(person.email, id);
    if (person.role === 'customer') {
      // Invented street address in an invented town.
      const town = rng.pick(demoTowns);
      const address: AddressSnapshot = {
        name: person.name,
        line1: `${rng.int(12, 4980)} ${rng.pick(demoStreets)}`,
        line2: rng.chance(0.25) ? `Apt ${rng.int(1, 40)}` : null,
        city: town.city,
        region: town.region,
        postalCode: `${town.postalPrefix}${String(rng.int(0, 99)).padStart(2, '0')}`,
        country: 'US',
      };
      addressByUser.set(id, address);
      addresses.push({ id: rng.uuid(), userId: id, ...address, isDefault: true, createdAt, updatedAt: createdAt });
    }
  }
  const idOf = (email: string) => userIdByEmail.get(email) as string;
  const emailById = new Map(users.map((u) => [u.id as string, u.email]));
  const nameById = new Map(users.map((u) => [u.id as string, u.name]));
  return {
    users,
    addresses,
    ownerId: idOf('owner@wrenfield.test'),
    roasterId: idOf('roaster@wrenfield.test'),
    packerId: idOf('packer@wrenfield.test'),
    customerIds: demoCustomers.map((c) => idOf(c.email)),
    demoCustomerId: idOf(DEMO_CUSTOMER_EMAIL),
    emailOf: (userId) => emailById.get(userId) as string,
    nameOf: (userId) => nameById.get(userId) as string,
    addressOf: (userId) => addressByUser.get(userId) as AddressSnapshot,
  };
}
