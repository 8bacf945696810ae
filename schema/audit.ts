import { bigint, index, integer, jsonb, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { users } from './users';

/** Append-only record of every change to users and roles (and later, curated data). */
export const auditLog = pgTable(
  'audit_log',
  {
    id: bigint({ mode: 'number' }).primaryKey().generatedAlwaysAsIdentity(),
    actorId: integer().references(() => users.id),
    at: timestamp({ withTimezone: true }).notNull().defaultNow(),
    action: text().notNull(),
    entityType: text().notNull(),
    entityId: text().notNull(),
    before: jsonb(),
    after: jsonb(),
  },
  (t) => [
    index('audit_log_entity_idx').on(t.entityType, t.entityId),
    index('audit_log_at_idx').on(t.at),
    // The audit screen's filters, each read newest first.
    index('audit_log_actor_at_idx').on(t.actorId, t.at),
    index('audit_log_action_at_idx').on(t.action, t.at),
    index('audit_log_entity_type_at_idx').on(t.entityType, t.at),
  ],
);

export type AuditRow = typeof auditLog.$inferSelect;
