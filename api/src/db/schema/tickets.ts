import { sql } from 'drizzle-orm';
import {
  index,
  integer,
  jsonb,
  pgEnum,
  pgSequence,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  boolean,
} from 'drizzle-orm/pg-core';
import {
  EQUIPMENT_TYPES,
  FUELS,
  MESSAGE_KINDS,
  TICKET_STATUSES,
  URGENCIES,
} from '../../../../shared/src/schemas/tickets';
import { contractorAccounts } from './accounts';
import { branches } from './branches';
import { users } from './users';

export const equipmentTypeEnum = pgEnum('equipment_type', EQUIPMENT_TYPES);
export const fuelEnum = pgEnum('fuel', FUELS);
export const urgencyEnum = pgEnum('urgency', URGENCIES);
export const ticketStatusEnum = pgEnum('ticket_status', TICKET_STATUSES);
export const messageKindEnum = pgEnum('message_kind', MESSAGE_KINDS);

export const equipmentModels = pgTable(
  'equipment_models',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    brand: text().notNull(),
    modelNumber: text().notNull().unique(),
    family: text().notNull(),
    type: equipmentTypeEnum().notNull(),
    fuels: fuelEnum()
      .array()
      .notNull()
      .default(sql`'{}'`),
    /** The model's spec table (stages, inputs, pressures, rise range); its schema grows with the checks. */
    spec: jsonb().$type<Record<string, unknown>>(),
    active: boolean().notNull().default(true),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('equipment_models_model_trgm').using('gin', sql`${t.modelNumber} gin_trgm_ops`)],
);

/** People read ticket numbers aloud on the phone: HV-10001, HV-10002, ... */
export const ticketNumberSeq = pgSequence('ticket_number_seq', { startWith: 10001 });

export const tickets = pgTable(
  'tickets',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    number: text()
      .notNull()
      .unique()
      .default(sql`'HV-' || nextval('ticket_number_seq')`),
    accountId: integer()
      .notNull()
      .references(() => contractorAccounts.id),
    openedById: integer()
      .notNull()
      .references(() => users.id),
    branchId: integer()
      .notNull()
      .references(() => branches.id),
    subject: text().notNull(),
    description: text().notNull().default(''),
    equipmentModelId: integer().references(() => equipmentModels.id),
    modelText: text(),
    serial: text(),
    fuel: fuelEnum().notNull(),
    urgency: urgencyEnum().notNull(),
    status: ticketStatusEnum().notNull().default('new'),
    assigneeId: integer().references(() => users.id),
    firstResponseAt: timestamp({ withTimezone: true }),
    resolvedAt: timestamp({ withTimezone: true }),
    resolutionSummary: text(),
    lastMessageAt: timestamp({ withTimezone: true }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index('tickets_account_idx').on(t.accountId, t.createdAt),
    index('tickets_branch_status_idx').on(t.branchId, t.status),
    index('tickets_assignee_idx').on(t.assigneeId),
    index('tickets_subject_trgm').using('gin', sql`${t.subject} gin_trgm_ops`),
  ],
);

export const ticketMessages = pgTable(
  'ticket_messages',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    ticketId: integer()
      .notNull()
      .references(() => tickets.id, { onDelete: 'cascade' }),
    authorId: integer().references(() => users.id),
    kind: messageKindEnum().notNull().default('message'),
    body: text().notNull(),
    /** Chosen by the sender's device; the same id twice is the same message. */
    clientId: text(),
    /** Structured content of an event message (a check result card). */
    data: jsonb().$type<Record<string, unknown>>(),
    /** Marked by the desk as part of the answer, for the write-up into an article. */
    partOfAnswer: boolean().notNull().default(false),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
    deliveredAt: timestamp({ withTimezone: true }),
    readAt: timestamp({ withTimezone: true }),
  },
  (t) => [
    uniqueIndex('ticket_messages_client_id_key').on(t.ticketId, t.clientId),
    index('ticket_messages_ticket_idx').on(t.ticketId, t.id),
  ],
);

export const attachments = pgTable(
  'attachments',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    ticketId: integer()
      .notNull()
      .references(() => tickets.id, { onDelete: 'cascade' }),
    messageId: integer().references(() => ticketMessages.id, { onDelete: 'set null' }),
    uploadedById: integer()
      .notNull()
      .references(() => users.id),
    storageKey: text().notNull().unique(),
    fileName: text().notNull(),
    contentType: text().notNull(),
    bytes: integer().notNull(),
    width: integer(),
    height: integer(),
    thumbnailKey: text(),
    sha256: text().notNull(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('attachments_ticket_idx').on(t.ticketId), index('attachments_message_idx').on(t.messageId)],
);

export const replySnippets = pgTable('reply_snippets', {
  id: integer().primaryKey().generatedAlwaysAsIdentity(),
  title: text().notNull(),
  body: text().notNull(),
  /** null: shared with the whole desk. */
  ownerId: integer().references(() => users.id, { onDelete: 'cascade' }),
  createdById: integer().references(() => users.id),
  createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
});

/** Status, assignment, branch and urgency history of each ticket. */
export const ticketEvents = pgTable(
  'ticket_events',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    ticketId: integer()
      .notNull()
      .references(() => tickets.id, { onDelete: 'cascade' }),
    actorId: integer().references(() => users.id),
    field: text().notNull(),
    fromValue: text(),
    toValue: text(),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('ticket_events_ticket_idx').on(t.ticketId)],
);

/** Minutes the desk aims to answer within, per urgency; admins change them. */
export const firstResponseTargets = pgTable('first_response_targets', {
  urgency: urgencyEnum().primaryKey(),
  minutes: integer().notNull(),
});

/** What was measured on the job, with the check's result against the unit's spec at the time. */
export const ticketReadings = pgTable(
  'ticket_readings',
  {
    id: integer().primaryKey().generatedAlwaysAsIdentity(),
    ticketId: integer()
      .notNull()
      .references(() => tickets.id, { onDelete: 'cascade' }),
    authorId: integer()
      .notNull()
      .references(() => users.id),
    kind: text().notNull(),
    values: jsonb().$type<Record<string, unknown>>().notNull(),
    result: jsonb().$type<Record<string, unknown>>().notNull(),
    verdict: text(),
    messageId: integer().references(() => ticketMessages.id, { onDelete: 'set null' }),
    createdAt: timestamp({ withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('ticket_readings_ticket_idx').on(t.ticketId, t.id)],
);
