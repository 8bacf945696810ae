import type { UserRow } from '../../../../schema';
import type { Database } from '../../db/client';
import { forbidden } from '../../lib/app-error';
import { auditRepository, type AuditFilter } from './audit-repository';
import { CURATED_ENTITY_TYPES, type AuditPage, type AuditQuery } from './audit-schemas';

const curated: readonly string[] = CURATED_ENTITY_TYPES;

export function createAuditService(db: Database) {
  return {
    /**
     * Admins read the whole log; editors read the audit of curated data only (the route lets
     * no one else in). An editor asking for another entity type is told so, not shown nothing.
     */
    async list(actor: UserRow, q: AuditQuery): Promise<AuditPage> {
      const scope = actor.role === 'admin' ? 'all' : 'curated';
      if (scope === 'curated' && q.entityType && !curated.includes(q.entityType)) {
        throw forbidden(
          `Editors see the audit of curated data only (${curated.join(', ')}), not ${q.entityType}`,
        );
      }
      const filter: AuditFilter = {
        actorLogin: q.actor,
        action: q.action,
        entityType: q.entityType,
        entityId: q.entityId,
        from: q.from ? new Date(q.from) : undefined,
        to: q.to ? new Date(q.to) : undefined,
        entityTypes: scope === 'curated' ? curated : undefined,
      };
      const { rows, total } = await auditRepository.list(db, filter, {
        offset: (q.page - 1) * q.pageSize,
        limit: q.pageSize,
      });
      return {
        entries: rows.map((r) => ({
          id: r.id,
          at: r.at.toISOString(),
          actor:
            r.actorId !== null && r.actorLogin !== null
              ? { id: r.actorId, login: r.actorLogin, name: r.actorName ?? r.actorLogin }
              : null,
          action: r.action,
          entityType: r.entityType,
          entityId: r.entityId,
          before: r.before,
          after: r.after,
        })),
        page: q.page,
        pageSize: q.pageSize,
        total,
        scope,
        entityTypes:
          scope === 'all'
            ? [...new Set([...curated, ...(await auditRepository.entityTypes(db))])].sort()
            : [...curated],
      };
    },
  };
}

export type AuditService = ReturnType<typeof createAuditService>;
