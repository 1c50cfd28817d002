import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { can } from '@shared/auth/permissions';
import { digestRunListQuery, updateDigestSettingsInput, updateDigestSubscriptionInput, type DigestRunListQuery } from '@shared/schemas/digest';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { validateBody, validateQuery } from '../../http/validate';
import type { MailOptions } from '../mail/mail-options';
import { listDigestCampaigns } from './digest-campaigns';
import { getDigestRun, listDigestRuns, previewDigest, sendDigestNow } from './digest-runs';
import { updateDigestSettings } from './digest-settings';
import { listSubscribers, updateOwnSubscription } from './digest-subscriptions';

/**
 * `/api/digests`: everyone may read digests and change their own subscription; leads and admins change a
 * campaign's digest settings, see who receives it and send it now.
 */
export function digestsRouter(dataSource: DataSource, mail: MailOptions): Router {
  const router = Router();

  router.get('/campaigns', requirePermission('read'), async (req, res) => {
    res.json(await listDigestCampaigns(dataSource, mail, req.user!.id));
  });

  router.get('/campaigns/:id/preview', requirePermission('read'), async (req, res) => {
    res.json(await previewDigest(dataSource, mail, parseId(req.params.id), req.user!));
  });

  router.get('/campaigns/:id/subscribers', requirePermission('digests:manage'), async (req, res) => {
    res.json({ subscribers: await listSubscribers(dataSource, parseId(req.params.id)) });
  });

  router.put('/campaigns/:id/subscription', requirePermission('read'), validateBody(updateDigestSubscriptionInput), async (req, res) => {
    res.json({ subscription: await updateOwnSubscription(dataSource, req.user!.id, parseId(req.params.id), req.body) });
  });

  router.put('/campaigns/:id/settings', requirePermission('digests:manage'), validateBody(updateDigestSettingsInput), async (req, res) => {
    res.json({ settings: await updateDigestSettings(dataSource, req.user!.id, parseId(req.params.id), req.body) });
  });

  router.post('/campaigns/:id/send', requirePermission('digests:manage'), async (req, res) => {
    res.status(201).json({ run: await sendDigestNow(dataSource, mail, parseId(req.params.id), req.user!.id) });
  });

  router.get('/runs', requirePermission('read'), validateQuery(digestRunListQuery), async (_req, res) => {
    res.json(await listDigestRuns(dataSource, res.locals.query as DigestRunListQuery));
  });

  router.get('/runs/:id', requirePermission('read'), async (req, res) => {
    res.json({ run: await getDigestRun(dataSource, mail, parseId(req.params.id), can(req.user!.role, 'digests:manage')) });
  });

  return router;
}
