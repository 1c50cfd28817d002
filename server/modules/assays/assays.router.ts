import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { assayListQuery, createAssayInput, refitAssayInput, type AssayListQuery } from '@shared/schemas/assay';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { validateBody, validateQuery } from '../../http/validate';
import { createAssay, getAssay, listAssays, refitAssay } from './assays.service';

/** `/api/assays`: assays with raw rate points, fitted on the server when saved or refitted. */
export function assaysRouter(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('read'), validateQuery(assayListQuery), async (_req, res) => {
    res.json(await listAssays(dataSource, res.locals.query as AssayListQuery));
  });

  router.post('/', requirePermission('measurements:write'), validateBody(createAssayInput), async (req, res) => {
    res.status(201).json(await createAssay(dataSource, req.user!.id, req.body));
  });

  router.get('/:id', requirePermission('read'), async (req, res) => {
    res.json({ assay: await getAssay(dataSource, parseId(req.params.id)) });
  });

  router.post('/:id/refit', requirePermission('measurements:write'), validateBody(refitAssayInput), async (req, res) => {
    res.status(201).json(await refitAssay(dataSource, req.user!.id, parseId(req.params.id), req.body));
  });

  return router;
}
