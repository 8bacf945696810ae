import { auditLog } from '../../../../schema';
import type { Database, Tx } from '../../db/client';

export interface AuditEntry {
  actorId: number | null;
  action: string;
  entityType: string;
  entityId: string | number;
  before?: unknown;
  after?: unknown;
}

/**
 * Called inside the transaction that makes the change, so the two land or fail together. A
 * record of something that changed nothing (a refused attempt, a sign-out) is written alone.
 * The table is append-only in the database itself: rows are never updated or deleted.
 */
export async function recordAudit(tx: Tx | Database, entry: AuditEntry): Promise<void> {
  await recordAudits(tx, [entry]);
}

export async function recordAudits(tx: Tx | Database, entries: AuditEntry[]): Promise<void> {
  if (entries.length === 0) return;
  await tx.insert(auditLog).values(
    entries.map((e) => ({
      actorId: e.actorId,
      action: e.action,
      entityType: e.entityType,
      entityId: String(e.entityId),
      before: e.before ?? null,
      after: e.after ?? null,
    })),
  );
}
