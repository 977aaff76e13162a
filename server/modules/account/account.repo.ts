import { and, asc, desc, eq, ne, sql } from 'drizzle-orm';
import { samePostalAddress } from '@shared/domain/address';
import type { AddressInput } from '@shared/schemas/account';
import type { PostalAddressInput } from '@shared/schemas/address';
import type { DbOrTx } from '../../db/client';
import { addresses } from '../../db/schema/index';

const addressColumns = {
  id: addresses.id,
  name: addresses.name,
  line1: addresses.line1,
  line2: addresses.line2,
  city: addresses.city,
  region: addresses.region,
  postalCode: addresses.postalCode,
  country: addresses.country,
  isDefault: addresses.isDefault,
} as const;

/** A customer's address book. Every query is scoped to the owner's id, so no one reaches another's addresses. */
export function createAccountRepo(db: DbOrTx) {
  return {
    listAddresses(userId: string) {
      return db.select(addressColumns).from(addresses).where(eq(addresses.userId, userId)).orderBy(desc(addresses.isDefault), asc(addresses.createdAt));
    },

    /** Adds an address; the first one, or one marked default, becomes the default. */
    addAddress(userId: string, input: AddressInput) {
      return db.transaction(async (tx) => {
        const [existing] = await tx.select({ id: addresses.id }).from(addresses).where(eq(addresses.userId, userId)).limit(1);
        const isDefault = input.isDefault || !existing;
        if (isDefault)
          await tx
            .update(addresses)
            .set({ isDefault: false })
            .where(and(eq(addresses.userId, userId), eq(addresses.isDefault, true)));
        const [row] = await tx
          .insert(addresses)
          .values({ ...input, userId, isDefault })
          .returning(addressColumns);
        return row!;
      });
    },

    /**
     * Keeps an address a checkout shipped to, unless the book already holds the same one; the first
     * address kept becomes the default. Serialised per account, so two checkouts at once keep one copy.
     */
    keepAddress(userId: string, address: PostalAddressInput) {
      return db.transaction(async (tx) => {
        await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${`address-book:${userId}`}))`);
        const book = await tx.select(addressColumns).from(addresses).where(eq(addresses.userId, userId));
        if (book.some((kept) => samePostalAddress(kept, address))) return;
        await tx.insert(addresses).values({ ...address, userId, isDefault: book.length === 0 });
      });
    },

    /** The updated address, or undefined when `userId` has no address `id`. */
    replaceAddress(userId: string, id: string, input: AddressInput) {
      return db.transaction(async (tx) => {
        const mine = and(eq(addresses.id, id), eq(addresses.userId, userId));
        const [current] = await tx.select({ isDefault: addresses.isDefault }).from(addresses).where(mine);
        if (!current) return undefined;
        // The default moves only when another address is chosen as default, never to none.
        const isDefault = input.isDefault || current.isDefault;
        if (input.isDefault) {
          await tx
            .update(addresses)
            .set({ isDefault: false })
            .where(and(eq(addresses.userId, userId), eq(addresses.isDefault, true), ne(addresses.id, id)));
        }
        const [row] = await tx
          .update(addresses)
          .set({ ...input, isDefault })
          .where(mine)
          .returning(addressColumns);
        return row;
      });
    },

    /** True when the address was the owner's and is gone; a deleted default passes to the oldest remaining address. */
    deleteAddress(userId: string, id: string) {
      return db.transaction(async (tx) => {
        const [deleted] = await tx
          .delete(addresses)
          .where(and(eq(addresses.id, id), eq(addresses.userId, userId)))
          .returning({ isDefault: addresses.isDefault });
        if (!deleted) return false;
        if (deleted.isDefault) {
          const [next] = await tx.select({ id: addresses.id }).from(addresses).where(eq(addresses.userId, userId)).orderBy(asc(addresses.createdAt)).limit(1);
          if (next) await tx.update(addresses).set({ isDefault: true }).where(eq(addresses.id, next.id));
        }
        return true;
      });
    },
  };
}

export type AccountRepo = ReturnType<typeof createAccountRepo>;
