import { z } from 'zod';
import { intText } from '../../middleware/validate';

/**
 * The contract of `GET /api/v1/audit`: the query (validated at the edge) and the answer
 * (checked in tests/api/audit.test.ts). The client imports the inferred types with `import type`.
 */

/**
 * Entity types of curated data: editors may read their audit, nothing else (users, sessions,
 * tokens stay with admins). A module that audits curated data names its entities from this list.
 */
export const CURATED_ENTITY_TYPES = [
  'species',
  'phase',
  'source',
  'revision',
  'proposal',
  'release',
  'dataset',
] as const;

const isoTime = z.iso.datetime({ offset: true, message: 'must be an ISO 8601 date and time' });
const text = (max: number) => z.string().trim().min(1).max(max);

export const AuditQuery = z
  .object({
    /** Who acted: a login (exact, any case). */
    actor: text(100).optional(),
    /** What was done, e.g. `user.role_changed`. */
    action: text(100).optional(),
    entityType: text(100).optional(),
    entityId: text(200).optional(),
    /** From this moment on (inclusive). */
    from: isoTime.optional(),
    /** Up to this moment (inclusive). */
    to: isoTime.optional(),
    /** 1-based. */
    page: intText(1, 100_000).default(1),
    pageSize: intText(1, 200).default(50),
  })
  .strict()
  .refine((q) => !q.from || !q.to || Date.parse(q.from) <= Date.parse(q.to), {
    message: '"from" must not be later than "to"',
    path: ['from'],
  });
export type AuditQuery = z.output<typeof AuditQuery>;

export const AuditEntryView = z.object({
  id: z.number().int(),
  /** ISO 8601. */
  at: z.string(),
  actor: z.object({ id: z.number().int(), login: z.string(), name: z.string() }).nullable(),
  action: z.string(),
  entityType: z.string(),
  entityId: z.string(),
  before: z.unknown(),
  after: z.unknown(),
});
export type AuditEntryView = z.infer<typeof AuditEntryView>;

/** `GET /api/v1/audit`: newest first. `scope` says whether the caller sees all or curated data only. */
export const AuditPage = z.object({
  entries: z.array(AuditEntryView),
  page: z.number().int(),
  pageSize: z.number().int(),
  total: z.number().int(),
  scope: z.enum(['all', 'curated']),
  /** The entity types this caller may filter by, for the screen's picker. */
  entityTypes: z.array(z.string()),
});
export type AuditPage = z.infer<typeof AuditPage>;
