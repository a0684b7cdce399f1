import { asc, eq } from 'drizzle-orm';
import type { Executor } from '../../db/client';
import { isoTime } from '../../db/sql';
import { ticketReadings, users } from '../../db/schema/index';
import type { Reading } from '../../../../shared/src/index';

const columns = {
  id: ticketReadings.id,
  ticketId: ticketReadings.ticketId,
  kind: ticketReadings.kind,
  values: ticketReadings.values,
  result: ticketReadings.result,
  verdict: ticketReadings.verdict,
  messageId: ticketReadings.messageId,
  createdAt: isoTime(ticketReadings.createdAt),
  authorId: users.id,
  authorName: users.name,
  authorRole: users.role,
};

type Row = { [K in keyof typeof columns]: unknown };
const toReading = ({ authorId, authorName, authorRole, ...r }: Row) =>
  ({ ...r, author: { id: authorId, name: authorName, role: authorRole } }) as Reading;

const base = (db: Executor) =>
  db.select(columns).from(ticketReadings).innerJoin(users, eq(users.id, ticketReadings.authorId));

export async function insertReading(
  db: Executor,
  values: typeof ticketReadings.$inferInsert,
): Promise<number> {
  const [row] = await db.insert(ticketReadings).values(values).returning({ id: ticketReadings.id });
  return row!.id;
}

export async function linkMessage(db: Executor, id: number, messageId: number) {
  await db.update(ticketReadings).set({ messageId }).where(eq(ticketReadings.id, id));
}

export async function findReading(db: Executor, id: number) {
  const [row] = await base(db).where(eq(ticketReadings.id, id));
  return row ? toReading(row) : undefined;
}

export async function listReadings(db: Executor, ticketId: number) {
  return (await base(db).where(eq(ticketReadings.ticketId, ticketId)).orderBy(asc(ticketReadings.id))).map(
    toReading,
  );
}
