import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { outboxMessageListQuery, receivedMessageListQuery, type OutboxMessageListQuery, type ReceivedMessageListQuery } from '@shared/schemas/mail';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { validateQuery } from '../../http/validate';
import type { MailDelivery } from './mail-delivery';
import { getOutboxMessage, getOutboxStatus, getReceivedMessage, listOutboxMessages, listReceivedMessages } from './outbox.service';

/** `/api/outbox` (admins): the send log and what the local fake SMTP server received. */
export function outboxRouter(dataSource: DataSource, delivery: MailDelivery | null): Router {
  const router = Router();
  router.use(requirePermission('users:manage'));

  router.get('/', async (_req, res) => {
    res.json(await getOutboxStatus(dataSource, delivery));
  });

  router.get('/messages', validateQuery(outboxMessageListQuery), async (_req, res) => {
    res.json(await listOutboxMessages(dataSource, res.locals.query as OutboxMessageListQuery));
  });

  router.get('/messages/:id', async (req, res) => {
    res.json({ message: await getOutboxMessage(dataSource, parseId(req.params.id)) });
  });

  router.get('/received', validateQuery(receivedMessageListQuery), async (_req, res) => {
    res.json(await listReceivedMessages(dataSource, res.locals.query as ReceivedMessageListQuery));
  });

  router.get('/received/:id', async (req, res) => {
    res.json({ message: await getReceivedMessage(dataSource, parseId(req.params.id)) });
  });

  return router;
}
