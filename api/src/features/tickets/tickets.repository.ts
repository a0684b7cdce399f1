import { and, count, desc, eq, ilike, inArray, isNull, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Executor } from '../../db/client';
import { isoTime } from '../../db/sql';
import {
  branches,
  contractorAccounts,
  equipmentModels,
  firstResponseTargets,
  ticketEvents,
  tickets,
  users,
} from '../../db/schema/index';
import type { EquipmentModel, Ticket, TicketStatus, Urgency } from '../../../../shared/src/index';
import { likePattern, offsetOf } from '../../lib/pagination';

const opener = alias(users, 'opener');
const assignee = alias(users, 'assignee');

const columns = {
  id: tickets.id,
  number: tickets.number,
  accountId: tickets.accountId,
  accountCompany: contractorAccounts.company,
  openedBy: { id: opener.id, name: opener.name },
  branchId: tickets.branchId,
  branchName: branches.name,
  subject: tickets.subject,
  description: tickets.description,
  equipmentModelId: equipmentModels.id,
  equipmentBrand: equipmentModels.brand,
  equipmentModelNumber: equipmentModels.modelNumber,
  equipmentFamily: equipmentModels.family,
  equipmentType: equipmentModels.type,
  modelText: tickets.modelText,
  serial: tickets.serial,
  fuel: tickets.fuel,
  urgency: tickets.urgency,
  status: tickets.status,
  assigneeId: assignee.id,
  assigneeName: assignee.name,
  firstResponseAt: isoTime(sql`${tickets.firstResponseAt}`),
  firstResponseDueAt: isoTime(
    sql`${tickets.createdAt} + make_interval(mins => coalesce(${firstResponseTargets.minutes}, 60))`,
  ),
  resolvedAt: isoTime(sql`${tickets.resolvedAt}`),
  resolutionSummary: tickets.resolutionSummary,
  createdAt: isoTime(tickets.createdAt),
  updatedAt: isoTime(sql`${tickets.updatedAt}`),
  lastMessageAt: isoTime(sql`${tickets.lastMessageAt}`),
  messageCount: sql<number>`(select count(*)::int from ticket_messages m where m.ticket_id = ${tickets.id} and m.kind = 'message')`,
};

type Row = {
  [K in keyof typeof columns]: unknown;
};

function toTicket(r: Row): Ticket {
  const row = r as Record<string, unknown>;
  return {
    id: row.id as number,
    number: row.number as string,
    accountId: row.accountId as number,
    accountCompany: row.accountCompany as string,
    openedBy: row.openedBy as Ticket['openedBy'],
    branchId: row.branchId as number,
    branchName: row.branchName as string,
    subject: row.subject as string,
    description: row.description as string,
    equipmentModel: row.equipmentModelId
      ? {
          id: row.equipmentModelId as number,
          brand: row.equipmentBrand as string,
          modelNumber: row.equipmentModelNumber as string,
          family: row.equipmentFamily as string,
          type: row.equipmentType as EquipmentModel['type'],
        }
      : null,
    modelText: row.modelText as string | null,
    serial: row.serial as string | null,
    fuel: row.fuel as Ticket['fuel'],
    urgency: row.urgency as Ticket['urgency'],
    status: row.status as Ticket['status'],
    assignee: row.assigneeId ? { id: row.assigneeId as number, name: row.assigneeName as string } : null,
    firstResponseAt: row.firstResponseAt as string | null,
    firstResponseDueAt: row.firstResponseDueAt as string,
    resolvedAt: row.resolvedAt as string | null,
    resolutionSummary: row.resolutionSummary as string | null,
    createdAt: row.createdAt as string,
    updatedAt: row.updatedAt as string,
    lastMessageAt: row.lastMessageAt as string | null,
    messageCount: row.messageCount as number,
  };
}

const base = (db: Executor) =>
  db
    .select(columns)
    .from(tickets)
    .innerJoin(contractorAccounts, eq(contractorAccounts.id, tickets.accountId))
    .innerJoin(opener, eq(opener.id, tickets.openedById))
    .innerJoin(branches, eq(branches.id, tickets.branchId))
    .leftJoin(equipmentModels, eq(equipmentModels.id, tickets.equipmentModelId))
    .leftJoin(assignee, eq(assignee.id, tickets.assigneeId))
    .leftJoin(firstResponseTargets, eq(firstResponseTargets.urgency, tickets.urgency));

/**
 * The two reads every chat message and ticket change makes, as named prepared statements: built
 * and planned once per connection instead of on every call.
 */
const prepared = new WeakMap<Executor, ReturnType<typeof prepare>>();
function prepare(db: Executor) {
  const id = sql.placeholder('id');
  return {
    ticket: base(db).where(eq(tickets.id, id)).prepare('ticket_by_id'),
    scope: scopeQuery(db).where(eq(tickets.id, id)).prepare('ticket_scope_by_id'),
  };
}
function statements(db: Executor) {
  let s = prepared.get(db);
  if (!s) prepared.set(db, (s = prepare(db)));
  return s;
}

export async function findTicket(db: Executor, id: number): Promise<Ticket | undefined> {
  const [row] = await statements(db).ticket.execute({ id });
  return row ? toTicket(row) : undefined;
}

/** Who a ticket belongs to, for the policy, without building the whole ticket. */
function scopeQuery(db: Executor) {
  return db
    .select({
      id: tickets.id,
      accountId: tickets.accountId,
      branchId: tickets.branchId,
      assigneeId: tickets.assigneeId,
      status: tickets.status,
      resolvedAt: tickets.resolvedAt,
      firstResponseAt: tickets.firstResponseAt,
      openedById: tickets.openedById,
    })
    .from(tickets);
}

export async function findTicketScope(db: Executor, id: number) {
  const [row] = await statements(db).scope.execute({ id });
  return row;
}
export type TicketScope = NonNullable<Awaited<ReturnType<typeof findTicketScope>>>;

export interface TicketFilter {
  accountId?: number;
  branchIds?: number[];
  orAssigneeId?: number;
  status?: TicketStatus | 'active';
  urgency?: Urgency;
  branchId?: number;
  assignee?: 'none' | number;
  q?: string;
}

export async function listTickets(db: Executor, f: TicketFilter, page: { page: number; pageSize: number }) {
  const where: SQL[] = [];
  if (f.accountId !== undefined) where.push(eq(tickets.accountId, f.accountId));
  if (f.branchIds) {
    const inBranches = inArray(tickets.branchId, f.branchIds.length ? f.branchIds : [-1]);
    where.push(f.orAssigneeId ? or(inBranches, eq(tickets.assigneeId, f.orAssigneeId))! : inBranches);
  }
  if (f.status === 'active') where.push(inArray(tickets.status, ['new', 'open', 'waiting-on-contractor']));
  else if (f.status) where.push(eq(tickets.status, f.status));
  if (f.urgency) where.push(eq(tickets.urgency, f.urgency));
  if (f.branchId) where.push(eq(tickets.branchId, f.branchId));
  if (f.assignee === 'none') where.push(isNull(tickets.assigneeId));
  else if (f.assignee) where.push(eq(tickets.assigneeId, f.assignee));
  if (f.q) {
    const p = likePattern(f.q);
    where.push(
      or(
        ilike(tickets.subject, p),
        ilike(tickets.number, p),
        ilike(tickets.serial, p),
        ilike(tickets.modelText, p),
        ilike(equipmentModels.modelNumber, p),
        ilike(contractorAccounts.company, p),
      )!,
    );
  }
  const condition = where.length ? and(...where) : undefined;
  const [rows, [total]] = await Promise.all([
    base(db)
      .where(condition)
      .orderBy(
        sql`case ${tickets.urgency} when 'emergency' then 0 when 'job-held' then 1 else 2 end`,
        desc(tickets.createdAt),
      )
      .limit(page.pageSize)
      .offset(offsetOf(page)),
    db
      .select({ n: count() })
      .from(tickets)
      .innerJoin(contractorAccounts, eq(contractorAccounts.id, tickets.accountId))
      .leftJoin(equipmentModels, eq(equipmentModels.id, tickets.equipmentModelId))
      .where(condition),
  ]);
  return { items: rows.map(toTicket), total: total?.n ?? 0 };
}

export async function insertTicket(db: Executor, values: typeof tickets.$inferInsert): Promise<number> {
  const [row] = await db.insert(tickets).values(values).returning({ id: tickets.id });
  return row!.id;
}

export async function updateTicketRow(db: Executor, id: number, patch: Partial<typeof tickets.$inferInsert>) {
  await db
    .update(tickets)
    .set({ ...patch, updatedAt: new Date() })
    .where(eq(tickets.id, id));
}

/** A message went in: the ticket's last activity, an optional status move, and the first answer's time. */
export async function touchAfterMessage(
  db: Executor,
  id: number,
  change: { status?: TicketStatus; stampFirstResponse: boolean },
) {
  await db
    .update(tickets)
    .set({
      lastMessageAt: new Date(),
      updatedAt: new Date(),
      ...(change.status ? { status: change.status } : {}),
      ...(change.stampFirstResponse
        ? { firstResponseAt: sql`coalesce(${tickets.firstResponseAt}, now())` }
        : {}),
    })
    .where(eq(tickets.id, id));
}

export async function insertEvents(
  db: Executor,
  events: {
    ticketId: number;
    actorId: number | null;
    field: string;
    fromValue: string | null;
    toValue: string | null;
  }[],
) {
  if (events.length) await db.insert(ticketEvents).values(events);
}

export async function findHomeBranchId(db: Executor, accountId: number): Promise<number | undefined> {
  const [row] = await db
    .select({ id: contractorAccounts.homeBranchId })
    .from(contractorAccounts)
    .where(eq(contractorAccounts.id, accountId));
  return row?.id;
}

export async function isStaffMember(db: Executor, userId: number): Promise<boolean> {
  const [row] = await db
    .select({ id: users.id })
    .from(users)
    .where(and(eq(users.id, userId), eq(users.active, true), sql`${users.role} <> 'contractor'`));
  return !!row;
}

export async function branchExists(db: Executor, id: number): Promise<boolean> {
  const [row] = await db
    .select({ id: branches.id })
    .from(branches)
    .where(and(eq(branches.id, id), eq(branches.active, true)));
  return !!row;
}

export async function firstResponseMinutes(db: Executor) {
  return db.select().from(firstResponseTargets);
}
