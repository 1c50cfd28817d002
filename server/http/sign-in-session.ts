import type { Request } from 'express';
import type { SessionUserDto } from '@shared/schemas/auth';
import { rotateCsrfToken } from './csrf';

/**
 * Signs a user in on this request's session, the way the sign-in route does: passport regenerates the
 * session (a planted session id is discarded) and a fresh CSRF token is issued.
 *
 * @param req the request
 * @param user the user to sign in
 * @returns the new CSRF token
 */
export async function signInSession(req: Request, user: SessionUserDto): Promise<string> {
  await new Promise<void>((resolve, reject) => req.login(user, (error) => (error ? reject(error) : resolve())));
  return rotateCsrfToken(req);
}
