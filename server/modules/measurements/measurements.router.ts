import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { createMeasurementInput } from '@shared/schemas/assay';
import { bulkReviewInput, measurementListQuery, reviewMeasurementInput, type MeasurementListQuery } from '@shared/schemas/measurement';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { validateBody, validateQuery } from '../../http/validate';
import {
  bulkReviewMeasurements,
  createEnteredMeasurement,
  getMeasurement,
  listMeasurements,
  reviewMeasurement,
} from './measurements.service';

/**
 * `/api/measurements`: directly entered measurements, the review list and the review state machine.
 * Reviewing needs `measurements:write` at the door; approving and flagging are further limited to
 * `measurements:review` in the service, which knows the action.
 */
export function measurementsRouter(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('read'), validateQuery(measurementListQuery), async (_req, res) => {
    res.json(await listMeasurements(dataSource, res.locals.query as MeasurementListQuery));
  });

  router.post('/', requirePermission('measurements:write'), validateBody(createMeasurementInput), async (req, res) => {
    res.status(201).json({ measurement: await createEnteredMeasurement(dataSource, req.user!.id, req.body) });
  });

  // Before '/:id' so that "review" is not read as an id.
  router.post('/review', requirePermission('measurements:write'), validateBody(bulkReviewInput), async (req, res) => {
    res.json({ items: await bulkReviewMeasurements(dataSource, req.user!, req.body) });
  });

  router.get('/:id', requirePermission('read'), async (req, res) => {
    res.json({ measurement: await getMeasurement(dataSource, parseId(req.params.id)) });
  });

  router.post('/:id/review', requirePermission('measurements:write'), validateBody(reviewMeasurementInput), async (req, res) => {
    res.json({ measurement: await reviewMeasurement(dataSource, req.user!, parseId(req.params.id), req.body) });
  });

  return router;
}
