import { boolean, integer, pgTable, text, timestamp, varchar } from 'drizzle-orm/pg-core';
import { branches } from './branches';

/** A contractor company that buys from the supply house. */
export const contractorAccounts = pgTable('contractor_accounts', {
  id: integer().primaryKey().generatedAlwaysAsIdentity(),
  company: text().notNull(),
  accountNumber: varchar({ length: 20 }).notNull().unique(),
  homeBranchId: integer()
    .notNull()
    .references(() => branches.id),
  active: boolean().notNull().default(true),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});
