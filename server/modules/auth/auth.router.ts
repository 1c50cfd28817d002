import { Router, type Request } from 'express';
import type { PassportStatic } from 'passport';
import type { DataSource } from 'typeorm';
import { changePasswordInput, signInInput, userPreferencesInput, type SessionUserDto } from '@shared/schemas/auth';
import { requireSignIn } from '../../http/auth';
import { csrfTokenFor, rotateCsrfToken } from '../../http/csrf';
import { invalidCredentials } from '../../http/errors';
import { validateBody } from '../../http/validate';
import { demoPassword, existingDemoAccounts } from '../../seed/demo-accounts';
import type { DatabaseSessionStore } from '../sessions/database-session-store';
import { changePassword, recordSignIn, updatePreferences } from '../users/users.service';
import { signInLimits } from './sign-in-limits';

function logIn(req: Request, user: SessionUserDto): Promise<void> {
  // passport 0.7 regenerates the session here, so the id an attacker may have planted is discarded.
  return new Promise((resolve, reject) => req.login(user, (error) => (error ? reject(error) : resolve())));
}

function logOut(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.logout((error) => (error ? reject(error) : resolve())));
}

function authenticateLocal(passport: PassportStatic, req: Request): Promise<SessionUserDto | false> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', { session: false }, (error: unknown, user: SessionUserDto | false) =>
      error ? reject(error) : resolve(user),
    )(req);
  });
}

export function authRouter(dataSource: DataSource, passport: PassportStatic, sessionStore: DatabaseSessionStore): Router {
  const router = Router();

  router.get('/csrf', (req, res) => {
    res.json({ csrfToken: csrfTokenFor(req) });
  });

  // The sign-in page offers the demo accounts only while they exist.
  router.get('/demo-accounts', async (_req, res) => {
    const accounts = await existingDemoAccounts(dataSource);
    res.json({ accounts, password: accounts.length > 0 ? demoPassword : null });
  });

  router.post('/sign-in', ...signInLimits(), validateBody(signInInput), async (req, res) => {
    const user = await authenticateLocal(passport, req);
    if (!user) throw invalidCredentials();
    await logIn(req, user);
    await recordSignIn(dataSource, user.id);
    res.json({ user, csrfToken: rotateCsrfToken(req) });
  });

  router.post('/sign-out', async (req, res) => {
    await logOut(req);
    rotateCsrfToken(req);
    res.status(204).end();
  });

  router.get('/me', requireSignIn, (req, res) => {
    res.json({ user: req.user });
  });

  router.patch('/preferences', requireSignIn, validateBody(userPreferencesInput), async (req, res) => {
    res.json({ preferences: await updatePreferences(dataSource, req.user!.id, req.body) });
  });

  router.post('/password', requireSignIn, validateBody(changePasswordInput), async (req, res) => {
    const user = req.user as SessionUserDto;
    await changePassword(dataSource, user.id, req.body.currentPassword, req.body.newPassword);
    // Every session of this user ends, including ones on other devices; this one continues under a new id.
    await sessionStore.destroyAllForUser(user.id);
    await logIn(req, user);
    res.json({ user, csrfToken: rotateCsrfToken(req) });
  });

  return router;
}
