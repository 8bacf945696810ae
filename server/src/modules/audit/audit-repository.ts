import { auditLog } from '../../../../schema';
import type { Tx } from '../../db/client';

export interface AuditEntry {
  actorId: number | null;
  action: string;
  entityType: string;
  entityId: string | number;
  before?: unknown;
  after?: unknown;
}

/** Always called inside the transaction that makes the change, so the two land or fail together. */
export async function recordAudit(tx: Tx, entry: AuditEntry): Promise<void> {
  await tx.insert(auditLog).values({
    actorId: entry.actorId,
    action: entry.action,
    entityType: entry.entityType,
    entityId: String(entry.entityId),
    before: entry.before ?? null,
    after: entry.after ?? null,
  });
}
