import { Router } from 'express';
import type { Database } from '../../db/client';
import { requireRole } from '../../middleware/require-role';
import { validate } from '../../middleware/validate';
import { AuditQuery, type AuditPage } from './audit-schemas';
import { createAuditService, type AuditService } from './audit-service';

/** Read-only: no body parser at all. */
export function auditRouter(audit: AuditService): Router {
  const router = Router();
  const list = validate({ query: AuditQuery });
  router.get('/audit', requireRole('editor'), list, async (req, res) => {
    res.json((await audit.list(req.user!, list.input(res).query)) satisfies AuditPage);
  });
  return router;
}

/** The audit log screen's API: `GET /api/v1/audit` (admins: all; editors: curated data). */
export function createAuditModule({ db }: { db: Database }) {
  const service = createAuditService(db);
  return { service, router: auditRouter(service) };
}
