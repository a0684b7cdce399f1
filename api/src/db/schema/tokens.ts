import { index, integer, pgTable, text, timestamp } from 'drizzle-orm/pg-core';
import { roleEnum, users } from './users';
import { contractorAccounts } from './accounts';

/**
 * An invitation to join: staff invited by an admin, or a teammate invited by an account owner into
 * their own account. Only the SHA-256 of the link's token is stored; it is single-use and expires.
 */
export const invitations = pgTable(
  'invitations',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    email: text().notNull(),
    role: roleEnum().notNull(),
    /** Set for a contractor teammate; null for staff. */
    accountId: integer().references(() => contractorAccounts.id),
    /** The branches a staff member will work at. */
    branchIds: integer().array().notNull().default([]),
    invitedById: integer()
      .notNull()
      .references(() => users.id),
    tokenHash: text().notNull().unique(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    acceptedAt: timestamp({ withTimezone: true }),
    acceptedUserId: integer().references(() => users.id),
    revokedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('invitations_account_idx').on(t.accountId)],
);

/** A password-reset link: the token's SHA-256 only, single-use, valid for 30 minutes. */
export const passwordResets = pgTable(
  'password_resets',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    userId: integer()
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: text().notNull().unique(),
    expiresAt: timestamp({ withTimezone: true }).notNull(),
    usedAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('password_resets_user_idx').on(t.userId)],
);
