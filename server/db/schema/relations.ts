import { relations } from 'drizzle-orm';
import { addresses, auditLog, invitations, passwordResetTokens, sessions, users } from './accounts';
import { lotPriceBreaks, lots, stockMovements, uploads } from './catalog';
import { journalEntries } from './journal';
import { orderItems, orders } from './orders';
import { bagAllocations, batches } from './roastery';
import { deliveries, rotationPicks, subscriptions } from './subscriptions';

// Relations for drizzle's relational queries (db.query.*). Kept in one file, after every table,
// so table modules never read each other at load time.

export const usersRelations = relations(users, ({ many }) => ({
  sessions: many(sessions),
  passwordResetTokens: many(passwordResetTokens),
  addresses: many(addresses),
  orders: many(orders),
  subscriptions: many(subscriptions),
  journalEntries: many(journalEntries),
  invitationsSent: many(invitations),
  batchesOperated: many(batches),
}));

export const sessionsRelations = relations(sessions, ({ one }) => ({
  user: one(users, { fields: [sessions.userId], references: [users.id] }),
}));

export const passwordResetTokensRelations = relations(passwordResetTokens, ({ one }) => ({
  user: one(users, { fields: [passwordResetTokens.userId], references: [users.id] }),
}));

export const invitationsRelations = relations(invitations, ({ one }) => ({
  invitedByUser: one(users, { fields: [invitations.invitedBy], references: [users.id] }),
}));

export const addressesRelations = relations(addresses, ({ one }) => ({
  user: one(users, { fields: [addresses.userId], references: [users.id] }),
}));

export const auditLogRelations = relations(auditLog, ({ one }) => ({
  actor: one(users, { fields: [auditLog.actorId], references: [users.id] }),
}));

export const lotsRelations = relations(lots, ({ many }) => ({
  priceBreaks: many(lotPriceBreaks),
  uploads: many(uploads),
  stockMovements: many(stockMovements),
  orderItems: many(orderItems),
  subscriptions: many(subscriptions),
  batches: many(batches),
  journalEntries: many(journalEntries),
  rotationPicks: many(rotationPicks),
}));

export const lotPriceBreaksRelations = relations(lotPriceBreaks, ({ one }) => ({
  lot: one(lots, { fields: [lotPriceBreaks.lotId], references: [lots.id] }),
}));

export const uploadsRelations = relations(uploads, ({ one }) => ({
  lot: one(lots, { fields: [uploads.lotId], references: [lots.id] }),
  uploader: one(users, { fields: [uploads.uploadedBy], references: [users.id] }),
}));

export const stockMovementsRelations = relations(stockMovements, ({ one }) => ({
  lot: one(lots, { fields: [stockMovements.lotId], references: [lots.id] }),
  order: one(orders, { fields: [stockMovements.orderId], references: [orders.id] }),
  batch: one(batches, { fields: [stockMovements.batchId], references: [batches.id] }),
  actor: one(users, { fields: [stockMovements.actorId], references: [users.id] }),
}));

export const ordersRelations = relations(orders, ({ one, many }) => ({
  user: one(users, { fields: [orders.userId], references: [users.id] }),
  subscription: one(subscriptions, { fields: [orders.subscriptionId], references: [subscriptions.id] }),
  delivery: one(deliveries, { fields: [orders.deliveryId], references: [deliveries.id] }),
  items: many(orderItems),
  bagAllocations: many(bagAllocations),
  stockMovements: many(stockMovements),
}));

export const orderItemsRelations = relations(orderItems, ({ one, many }) => ({
  order: one(orders, { fields: [orderItems.orderId], references: [orders.id] }),
  lot: one(lots, { fields: [orderItems.lotId], references: [lots.id] }),
  bagAllocations: many(bagAllocations),
}));

export const subscriptionsRelations = relations(subscriptions, ({ one, many }) => ({
  user: one(users, { fields: [subscriptions.userId], references: [users.id] }),
  lot: one(lots, { fields: [subscriptions.lotId], references: [lots.id] }),
  deliveries: many(deliveries),
  orders: many(orders),
}));

export const deliveriesRelations = relations(deliveries, ({ one }) => ({
  subscription: one(subscriptions, { fields: [deliveries.subscriptionId], references: [subscriptions.id] }),
  order: one(orders, { fields: [deliveries.orderId], references: [orders.id] }),
}));

export const rotationPicksRelations = relations(rotationPicks, ({ one }) => ({
  lot: one(lots, { fields: [rotationPicks.lotId], references: [lots.id] }),
  picker: one(users, { fields: [rotationPicks.pickedBy], references: [users.id] }),
}));

export const batchesRelations = relations(batches, ({ one, many }) => ({
  lot: one(lots, { fields: [batches.lotId], references: [lots.id] }),
  operator: one(users, { fields: [batches.operatorId], references: [users.id] }),
  bagAllocations: many(bagAllocations),
  stockMovements: many(stockMovements),
}));

export const bagAllocationsRelations = relations(bagAllocations, ({ one }) => ({
  batch: one(batches, { fields: [bagAllocations.batchId], references: [batches.id] }),
  orderItem: one(orderItems, { fields: [bagAllocations.orderItemId], references: [orderItems.id] }),
  order: one(orders, { fields: [bagAllocations.orderId], references: [orders.id] }),
}));

export const journalEntriesRelations = relations(journalEntries, ({ one }) => ({
  user: one(users, { fields: [journalEntries.userId], references: [users.id] }),
  lot: one(lots, { fields: [journalEntries.lotId], references: [lots.id] }),
}));
