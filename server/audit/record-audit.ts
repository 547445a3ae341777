import type { Database } from '../../db/client.ts';
import { auditEvents } from '../../db/schema/index.ts';
import type { AuditDetail } from '../../shared/contracts/team.ts';

/** Anything that can run an insert: the database or an open transaction. */
export type Executor = Pick<Database, 'insert'>;

export interface AuditEntry {
  actorId: string | null;
  action: string;
  objectType: string;
  objectId?: string | null;
  detail?: AuditDetail;
}

/** Appends one audit event (inside the caller's transaction when given one). */
export async function recordAudit(db: Executor, entry: AuditEntry): Promise<void> {
  await db.insert(auditEvents).values({
    actorId: entry.actorId,
    action: entry.action,
    objectType: entry.objectType,
    objectId: entry.objectId ?? null,
    detail: entry.detail ?? {},
  });
}
