import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { overviewQuery } from '@shared/schemas/overview';
import { requirePermission } from '../../http/auth';
import { validateQuery } from '../../http/validate';
import { getOverview } from './overview.service';

/** `/api/overview`: the home page's summary of every campaign, readable by every role. */
export function overviewRouter(dataSource: DataSource): Router {
  const router = Router();
  router.get('/', requirePermission('read'), validateQuery(overviewQuery), async (_req, res) => {
    res.json(await getOverview(dataSource));
  });
  return router;
}
