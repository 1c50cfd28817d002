import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { createCampaignInput, updateCampaignInput } from '@shared/schemas/campaign';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { validateBody } from '../../http/validate';
import { createCampaign, getCampaign, listCampaigns, listLeadCandidates, updateCampaign } from './campaigns.service';

/** `/api/campaigns`: campaigns with their variant counts; settings are for leads and admins. */
export function campaignsRouter(dataSource: DataSource): Router {
  const router = Router();

  router.get('/', requirePermission('read'), async (_req, res) => {
    res.json(await listCampaigns(dataSource));
  });

  router.post('/', requirePermission('campaigns:manage'), validateBody(createCampaignInput), async (req, res) => {
    res.status(201).json(await createCampaign(dataSource, req.user!.id, req.body));
  });

  // Before '/:id' so that "lead-candidates" is not read as an id. Only those who set a lead need the list.
  router.get('/lead-candidates', requirePermission('campaigns:manage'), async (_req, res) => {
    res.json(await listLeadCandidates(dataSource));
  });

  router.get('/:id', requirePermission('read'), async (req, res) => {
    res.json(await getCampaign(dataSource, parseId(req.params.id)));
  });

  router.patch('/:id', requirePermission('campaigns:manage'), validateBody(updateCampaignInput), async (req, res) => {
    res.json(await updateCampaign(dataSource, req.user!.id, parseId(req.params.id), req.body));
  });

  return router;
}
