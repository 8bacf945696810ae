import {
  and,
  count,
  desc,
  eq,
  getTableColumns,
  gte,
  inArray,
  lte,
  sql,
  type SQL,
} from 'drizzle-orm';
import { auditLog, users, type AuditRow } from '../../../../schema';
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

export interface AuditFilter {
  actorLogin?: string;
  action?: string;
  entityType?: string;
  entityId?: string;
  from?: Date;
  to?: Date;
  /** When set, only these entity types. */
  entityTypes?: readonly string[];
}

export interface AuditListRow extends AuditRow {
  actorLogin: string | null;
  actorName: string | null;
}

function conditions(f: AuditFilter): SQL | undefined {
  return and(
    f.actorLogin ? sql`lower(${users.login}) = lower(${f.actorLogin})` : undefined,
    f.action ? eq(auditLog.action, f.action) : undefined,
    f.entityType ? eq(auditLog.entityType, f.entityType) : undefined,
    f.entityId ? eq(auditLog.entityId, f.entityId) : undefined,
    f.from ? gte(auditLog.at, f.from) : undefined,
    f.to ? lte(auditLog.at, f.to) : undefined,
    f.entityTypes ? inArray(auditLog.entityType, [...f.entityTypes]) : undefined,
  );
}

export const auditRepository = {
  /** One page of the log, newest first, with who acted; and how many rows match in all. */
  async list(
    db: Tx | Database,
    filter: AuditFilter,
    page: { offset: number; limit: number },
  ): Promise<{ rows: AuditListRow[]; total: number }> {
    const where = conditions(filter);
    const rows = await db
      .select({ ...getTableColumns(auditLog), actorLogin: users.login, actorName: users.name })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorId))
      .where(where)
      .orderBy(desc(auditLog.at), desc(auditLog.id))
      .offset(page.offset)
      .limit(page.limit);
    const [{ total }] = await db
      .select({ total: count() })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorId))
      .where(where);
    return { rows, total };
  },

  /** Every entity type the log holds (a handful; read from the entity-type index). */
  async entityTypes(db: Tx | Database): Promise<string[]> {
    const rows = await db
      .selectDistinct({ entityType: auditLog.entityType })
      .from(auditLog)
      .orderBy(auditLog.entityType);
    return rows.map((r) => r.entityType);
  },
};
