import { sql } from 'drizzle-orm';
import { boolean, check, integer, pgEnum, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import { ROLES } from '../../../../shared/src/schemas/auth';
import { contractorAccounts } from './accounts';

export const roleEnum = pgEnum('user_role', ROLES);

export const users = pgTable(
  'users',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    email: text().notNull(),
    name: text().notNull(),
    role: roleEnum().notNull(),
    passwordHash: text().notNull(),
    active: boolean().notNull().default(true),
    accountId: integer().references(() => contractorAccounts.id),
    isAccountOwner: boolean().notNull().default(false),
    lastSignInAt: timestamp({ withTimezone: true }),
    /** Optional e-mails the user can turn off on their profile or with the link in the e-mail. */
    mailTicketReceived: boolean().notNull().default(true),
    mailReplies: boolean().notNull().default(true),
    mailResolved: boolean().notNull().default(true),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    // E-mail is unique whatever its case.
    uniqueIndex('users_email_lower_key').on(sql`lower(${t.email})`),
    check('users_contractor_has_account', sql`(${t.role} = 'contractor') = (${t.accountId} is not null)`),
    check('users_owner_is_contractor', sql`not ${t.isAccountOwner} or ${t.role} = 'contractor'`),
  ],
);
