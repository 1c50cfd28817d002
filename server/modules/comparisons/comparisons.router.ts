import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { comparisonQuery, type ComparisonQuery } from '@shared/schemas/comparison';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { validateQuery } from '../../http/validate';
import { getCampaignCycles, getCampaignLandscape, getVariantComparison } from './comparisons.service';

/**
 * Derived views mounted at `/api` itself: `/variants/:id/comparison`, `/campaigns/:id/cycles`,
 * `/campaigns/:id/landscape`. Every route carries its own guard, because a router mounted at the root must
 * not put a guard in front of every other `/api` route.
 */
export function comparisonsRouter(dataSource: DataSource): Router {
  const router = Router();

  router.get('/variants/:id/comparison', requirePermission('read'), validateQuery(comparisonQuery), async (req, res) => {
    const { states } = res.locals.query as ComparisonQuery;
    res.json(await getVariantComparison(dataSource, parseId(req.params.id), states));
  });

  router.get('/campaigns/:id/cycles', requirePermission('read'), validateQuery(comparisonQuery), async (req, res) => {
    const { states } = res.locals.query as ComparisonQuery;
    res.json(await getCampaignCycles(dataSource, parseId(req.params.id), states));
  });

  router.get('/campaigns/:id/landscape', requirePermission('read'), async (req, res) => {
    res.json(await getCampaignLandscape(dataSource, parseId(req.params.id)));
  });

  return router;
}
