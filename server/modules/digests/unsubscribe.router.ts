import express, { Router } from 'express';
import type { DataSource } from 'typeorm';
import { unsubscribeInput } from '@shared/schemas/digest';
import { linkTokenQuery, type LinkTokenQuery } from '@shared/schemas/link-token';
import { parseOrThrow, validateQuery } from '../../http/validate';
import { lookupUnsubscribe, unsubscribeWithToken } from './digest-subscriptions';

/**
 * `/api/digests/unsubscribe`, mounted before the CSRF check: a mail client's one-click unsubscribe
 * (RFC 8058) POSTs `List-Unsubscribe=One-Click` as a form with the token in the URL and without any
 * session, and the link in the message body leads to a page that POSTs `{ token }`. The token is the
 * credential, and it can do nothing but unsubscribe. GET only looks up, since link scanners fetch links.
 */
export function unsubscribeRouter(dataSource: DataSource): Router {
  const router = Router();
  router.use(express.urlencoded({ extended: false, limit: '1kb' }));

  router.get('/', validateQuery(linkTokenQuery), async (_req, res) => {
    res.json({ unsubscribe: await lookupUnsubscribe(dataSource, (res.locals.query as LinkTokenQuery).token) });
  });

  router.post('/', async (req, res) => {
    const body = (req.body ?? {}) as Record<string, unknown>;
    const { token } = parseOrThrow(unsubscribeInput, { token: typeof body.token === 'string' ? body.token : req.query.token });
    res.json({ unsubscribe: await unsubscribeWithToken(dataSource, token) });
  });

  return router;
}
