import { sql } from 'drizzle-orm';
import { boolean, check, index, integer, jsonb, pgTable, text, uniqueIndex, uuid } from 'drizzle-orm/pg-core';
import { instant, timestamps } from './common';
import { roleEnum } from './enums';

export const users = pgTable(
  'users',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    /** Always stored lower-case (CHECK), unique. */
    email: text('email').notNull(),
    name: text('name').notNull(),
    passwordHash: text('password_hash').notNull(),
    role: roleEnum('role').notNull().default('customer'),
    disabledAt: instant('disabled_at'),
    ...timestamps(),
  },
  (t) => [
    uniqueIndex('users_email_key').on(t.email),
    check('users_email_lower_case', sql`${t.email} = lower(${t.email})`),
    check('users_email_shape', sql`position('@' in ${t.email}) > 1`),
    check('users_name_not_blank', sql`length(trim(${t.name})) > 0`),
    index('users_role_idx').on(t.role),
  ],
);

/** Server-side sessions; the cookie carries the id (a random token). */
export const sessions = pgTable(
  'sessions',
  {
    id: text('id').primaryKey(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: instant('created_at').notNull().defaultNow(),
    lastSeenAt: instant('last_seen_at').notNull().defaultNow(),
    expiresAt: instant('expires_at').notNull(),
    revokedAt: instant('revoked_at'),
    userAgent: text('user_agent'),
    ip: text('ip'),
  },
  (t) => [index('sessions_user_id_idx').on(t.userId), index('sessions_expires_at_idx').on(t.expiresAt)],
);

export const passwordResetTokens = pgTable(
  'password_reset_tokens',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    /** SHA-256 of the token sent by e-mail; the token itself is never stored. */
    tokenHash: text('token_hash').notNull(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    createdAt: instant('created_at').notNull().defaultNow(),
    expiresAt: instant('expires_at').notNull(),
    usedAt: instant('used_at'),
  },
  (t) => [uniqueIndex('password_reset_tokens_token_hash_key').on(t.tokenHash), index('password_reset_tokens_user_id_idx').on(t.userId)],
);

/** Team invitations sent by the owner (staff or owner role). */
export const invitations = pgTable(
  'invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    email: text('email').notNull(),
    role: roleEnum('role').notNull(),
    tokenHash: text('token_hash').notNull(),
    invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: instant('created_at').notNull().defaultNow(),
    expiresAt: instant('expires_at').notNull(),
    acceptedAt: instant('accepted_at'),
  },
  (t) => [
    uniqueIndex('invitations_token_hash_key').on(t.tokenHash),
    index('invitations_email_idx').on(t.email),
    check('invitations_email_lower_case', sql`${t.email} = lower(${t.email})`),
  ],
);

/** A customer's address book. At most one default address per user (partial unique index). */
export const addresses = pgTable(
  'addresses',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    name: text('name').notNull(),
    line1: text('line1').notNull(),
    line2: text('line2'),
    city: text('city').notNull(),
    region: text('region').notNull(),
    postalCode: text('postal_code').notNull(),
    country: text('country').notNull().default('US'),
    isDefault: boolean('is_default').notNull().default(false),
    ...timestamps(),
  },
  (t) => [
    index('addresses_user_id_idx').on(t.userId),
    uniqueIndex('addresses_one_default_per_user')
      .on(t.userId)
      .where(sql`${t.isDefault}`),
    check('addresses_country_code', sql`${t.country} ~ '^[A-Z]{2}$'`),
  ],
);

/** Security-relevant events: sign-in attempts, authorization failures, role changes. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    at: instant('at').notNull().defaultNow(),
    actorId: uuid('actor_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').notNull(),
    ip: text('ip'),
    detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
  },
  (t) => [index('audit_log_at_idx').on(t.at), index('audit_log_action_at_idx').on(t.action, t.at), index('audit_log_actor_id_idx').on(t.actorId)],
);

/**
 * Fixed-window counters for throttling sign-in, sign-up and password reset, shared by every app
 * process. The key is a SHA-256 of the bucket and its subject (IP, e-mail), so no address is stored.
 */
export const throttleCounters = pgTable(
  'throttle_counters',
  {
    key: text('key').primaryKey(),
    hits: integer('hits').notNull(),
    resetAt: instant('reset_at').notNull(),
  },
  (t) => [index('throttle_counters_reset_at_idx').on(t.resetAt), check('throttle_counters_hits_not_negative', sql`${t.hits} >= 0`)],
);
