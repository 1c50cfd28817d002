import { randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { HttpError } from './errors';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Returns the session's CSRF token, creating one when the session has none. */
export function csrfTokenFor(req: Request): string {
  req.session.csrfToken ??= randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

/** Replaces the session's token; called whenever the session is regenerated (sign-in, sign-out). */
export function rotateCsrfToken(req: Request): string {
  req.session.csrfToken = undefined;
  return csrfTokenFor(req);
}

/**
 * Session-bound synchroniser token: every state-changing request must echo the token from
 * `GET /api/auth/csrf` in the `X-CSRF-Token` header.
 */
export const requireCsrfToken: RequestHandler = (req, _res, next) => {
  if (safeMethods.has(req.method)) return next();
  const expected = req.session?.csrfToken;
  const sent = req.get('x-csrf-token');
  if (!expected || !sent || !sameToken(sent, expected)) {
    throw new HttpError(403, 'csrf_invalid', 'The request is missing a valid X-CSRF-Token header; fetch /api/auth/csrf and retry.');
  }
  next();
};

function sameToken(sent: string, expected: string): boolean {
  const a = Buffer.from(sent);
  const b = Buffer.from(expected);
  return a.length === b.length && timingSafeEqual(a, b);
}
