import { relations } from 'drizzle-orm';
import { user } from './auth';
import { disputeComments, disputes, payAppLines, payApps, payAppStatusHistory } from './pay-apps';
import { tallies } from './tallies';

/**
 * Relations for Drizzle's relational queries (`db.query.payApps.findFirst({ with })`), which read a pay application
 * with its lines, history, disputes and tallies in one SQL statement. They add no tables or constraints, so
 * drizzle-kit ignores them.
 */
export const payAppsRelations = relations(payApps, ({ one, many }) => ({
  lines: many(payAppLines),
  history: many(payAppStatusHistory),
  disputes: many(disputes),
  tallies: many(tallies),
  certifiedBy: one(user, { fields: [payApps.certifiedByUserId], references: [user.id] }),
}));

export const payAppLinesRelations = relations(payAppLines, ({ one }) => ({
  payApp: one(payApps, { fields: [payAppLines.payAppId], references: [payApps.id] }),
}));

export const payAppStatusHistoryRelations = relations(payAppStatusHistory, ({ one }) => ({
  payApp: one(payApps, { fields: [payAppStatusHistory.payAppId], references: [payApps.id] }),
  actor: one(user, { fields: [payAppStatusHistory.actorUserId], references: [user.id] }),
}));

export const disputesRelations = relations(disputes, ({ one, many }) => ({
  payApp: one(payApps, { fields: [disputes.payAppId], references: [payApps.id] }),
  openedBy: one(user, { fields: [disputes.openedByUserId], references: [user.id], relationName: 'disputeOpenedBy' }),
  resolvedBy: one(user, { fields: [disputes.resolvedByUserId], references: [user.id], relationName: 'disputeResolvedBy' }),
  comments: many(disputeComments),
}));

export const disputeCommentsRelations = relations(disputeComments, ({ one }) => ({
  dispute: one(disputes, { fields: [disputeComments.disputeId], references: [disputes.id] }),
  author: one(user, { fields: [disputeComments.authorUserId], references: [user.id] }),
}));

export const talliesPayAppRelations = relations(tallies, ({ one }) => ({
  payApp: one(payApps, { fields: [tallies.payAppId], references: [payApps.id] }),
}));
