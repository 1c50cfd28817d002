import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { linkTokenQuery, type LinkTokenQuery } from '@shared/schemas/link-token';
import { completePasswordResetInput, passwordResetRequestedMessage, requestPasswordResetInput } from '@shared/schemas/password-reset';
import { signInSession } from '../../http/sign-in-session';
import { validateBody, validateQuery } from '../../http/validate';
import type { MailOptions } from '../mail/mail-options';
import { recordSignIn } from '../users/users.service';
import { completePasswordReset, lookupPasswordReset, requestPasswordReset } from './password-resets.service';
import { passwordResetLimits } from './reset-limits';

/**
 * `/api/password-resets`, for people who cannot sign in: open to everyone, rate limited, and answering a
 * request the same way whether or not the address has an account. The link's token is the credential.
 */
export function passwordResetsRouter(dataSource: DataSource, mail: MailOptions): Router {
  const router = Router();

  router.post('/', ...passwordResetLimits(), validateBody(requestPasswordResetInput), (req, res) => {
    // The answer goes out before the lookup, so neither its content nor its timing says whether the address has an account.
    res.status(202).json({ message: passwordResetRequestedMessage });
    requestPasswordReset(dataSource, mail, req.body.email).catch((error: unknown) => console.error('Password-reset request failed:', error));
  });

  router.get('/lookup', validateQuery(linkTokenQuery), async (_req, res) => {
    res.json({ reset: await lookupPasswordReset(dataSource, (res.locals.query as LinkTokenQuery).token) });
  });

  router.post('/complete', validateBody(completePasswordResetInput), async (req, res) => {
    const user = await completePasswordReset(dataSource, req.body);
    const csrfToken = await signInSession(req, user);
    await recordSignIn(dataSource, user.id);
    res.json({ user, csrfToken });
  });

  return router;
}
