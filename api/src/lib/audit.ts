import type { Executor } from '../db/client';
import { auditLog } from '../db/schema/index';

export interface AuditEntry {
  actorId: number | null;
  action: string;
  targetType: string;
  targetId?: string | number | null;
  details?: Record<string, unknown>;
}

export async function audit(db: Executor, entry: AuditEntry): Promise<void> {
  await db.insert(auditLog).values({
    actorId: entry.actorId,
    action: entry.action,
    targetType: entry.targetType,
    targetId: entry.targetId == null ? null : String(entry.targetId),
    details: entry.details,
  });
}
