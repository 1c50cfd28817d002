import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { acceptInvitationInput, createInvitationInput, revokeInvitationInput } from '@shared/schemas/invitation';
import { linkTokenQuery, type LinkTokenQuery } from '@shared/schemas/link-token';
import { requirePermission } from '../../http/auth';
import { parseId } from '../../http/params';
import { signInSession } from '../../http/sign-in-session';
import { validateBody, validateQuery } from '../../http/validate';
import type { MailOptions } from '../mail/mail-options';
import { recordSignIn } from '../users/users.service';
import { acceptInvitation, createInvitation, listInvitations, lookupInvitation, revokeInvitation } from './invitations.service';

/**
 * `/api/invitations`. Inviting, listing and withdrawing are for admins. Looking up and accepting are open
 * to anyone holding the link: the token is the credential (and accepting still needs the CSRF token of
 * the visitor's session).
 */
export function invitationsRouter(dataSource: DataSource, mail: MailOptions): Router {
  const router = Router();

  router.get('/lookup', validateQuery(linkTokenQuery), async (_req, res) => {
    res.json({ invitation: await lookupInvitation(dataSource, (res.locals.query as LinkTokenQuery).token) });
  });

  router.post('/accept', validateBody(acceptInvitationInput), async (req, res) => {
    const user = await acceptInvitation(dataSource, req.body);
    const csrfToken = await signInSession(req, user);
    await recordSignIn(dataSource, user.id);
    res.status(201).json({ user, csrfToken });
  });

  router.get('/', requirePermission('users:manage'), async (_req, res) => {
    res.json({ invitations: await listInvitations(dataSource) });
  });

  router.post('/', requirePermission('users:manage'), validateBody(createInvitationInput), async (req, res) => {
    res.status(201).json({ invitation: await createInvitation(dataSource, mail, req.user!, req.body) });
  });

  router.post('/:id/revoke', requirePermission('users:manage'), validateBody(revokeInvitationInput), async (req, res) => {
    res.json({ invitation: await revokeInvitation(dataSource, req.user!.id, parseId(req.params.id), req.body.version) });
  });

  return router;
}
