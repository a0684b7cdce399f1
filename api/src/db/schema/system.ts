import { index, integer, jsonb, pgTable, text, timestamp, varchar, json } from 'drizzle-orm/pg-core';
import { users } from './users';

/** The table connect-pg-simple reads and writes (its own documented layout). */
export const sessions = pgTable(
  'session',
  {
    sid: varchar().primaryKey(),
    sess: json().notNull(),
    expire: timestamp({ precision: 6 }).notNull(),
  },
  (t) => [index('IDX_session_expire').on(t.expire)],
);

/** Who did what to which record, for admins to review. */
export const auditLog = pgTable(
  'audit_log',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    actorId: integer().references(() => users.id),
    action: text().notNull(),
    targetType: text().notNull(),
    targetId: text(),
    details: jsonb().$type<Record<string, unknown>>(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('audit_log_target_idx').on(t.targetType, t.targetId)],
);

/** Hit counters for rate limits, shared by every API instance. */
export const rateLimitHits = pgTable('rate_limit_hits', {
  key: text().primaryKey(),
  hits: integer().notNull(),
  resetAt: timestamp({ withTimezone: true }).notNull(),
});
