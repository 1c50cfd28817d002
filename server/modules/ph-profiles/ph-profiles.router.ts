import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { createPhProfileInput, phProfileListQuery } from '@shared/schemas/ph-profile';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { validateBody, validateQuery } from '../../http/validate';
import { createPhProfile, getPhProfile, listPhProfiles } from './ph-profiles.service';

/** `/api/ph-profiles`: pH–rate profiles, fitted on the server, with the pKa reading. */
export function phProfilesRouter(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('read'), validateQuery(phProfileListQuery), async (_req, res) => {
    const { variantId } = res.locals.query as { variantId: number };
    res.json({ items: await listPhProfiles(dataSource, variantId) });
  });

  router.post('/', requirePermission('measurements:write'), validateBody(createPhProfileInput), async (req, res) => {
    res.status(201).json({ profile: await createPhProfile(dataSource, req.user!.id, req.body) });
  });

  router.get('/:id', requirePermission('read'), async (req, res) => {
    res.json({ profile: await getPhProfile(dataSource, parseId(req.params.id)) });
  });

  return router;
}
