import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { listAuditQuery, type ListAuditQuery } from '@shared/schemas/audit';
import { requirePermission } from '../../http/auth';
import { validateQuery } from '../../http/validate';
import { listAuditEvents } from './audit.service';

/** `/api/audit`: the trail of changes, newest first, for activity feeds and histories. */
export function auditRouter(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', requirePermission('read'), validateQuery(listAuditQuery), async (_req, res) => {
    res.json(await listAuditEvents(dataSource, res.locals.query as ListAuditQuery));
  });
  return router;
}
