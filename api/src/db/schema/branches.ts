import { boolean, integer, pgTable, primaryKey, text, timestamp, varchar } from 'drizzle-orm/pg-core';
import { users } from './users';

export const branches = pgTable('branches', {
  id: integer().primaryKey().generatedAlwaysAsIdentity(),
  code: varchar({ length: 8 }).notNull().unique(),
  name: text().notNull(),
  deskEmail: text(),
  active: boolean().notNull().default(true),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

/** Staff (tech, specialist, admin) belong to one or more branches. */
export const staffBranches = pgTable(
  'staff_branches',
  {
    userId: integer()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    branchId: integer()
      .notNull()
      .references(() => branches.id, { onDelete: 'cascade' }),
  },
  (t) => [primaryKey({ columns: [t.userId, t.branchId] })],
);
