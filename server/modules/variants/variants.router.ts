import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { createVariantInput, listVariantsQuery, updateVariantInput, type ListVariantsQuery } from '@shared/schemas/variant';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { validateBody, validateQuery } from '../../http/validate';
import { listVariantsResponse } from './list-variants';
import { createVariant, getVariant, updateVariant } from './variants.service';

/** `/api/variants`: the registry list, one variant, registration and edits. */
export function variantsRouter(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('read'), validateQuery(listVariantsQuery), async (_req, res) => {
    const { body, etag } = await listVariantsResponse(dataSource, res.locals.query as ListVariantsQuery);
    // With the tag set, Express answers a matching If-None-Match with 304 and does not hash the body again.
    res.type('application/json').set('ETag', etag).send(body);
  });

  router.post('/', requirePermission('variants:write'), validateBody(createVariantInput), async (req, res) => {
    res.status(201).json(await createVariant(dataSource, req.user!.id, req.body));
  });

  router.get('/:id', requirePermission('read'), async (req, res) => {
    res.json(await getVariant(dataSource, parseId(req.params.id)));
  });

  router.patch('/:id', requirePermission('variants:write'), validateBody(updateVariantInput), async (req, res) => {
    res.json(await updateVariant(dataSource, req.user!.id, parseId(req.params.id), req.body));
  });

  return router;
}
