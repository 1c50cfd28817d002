/**
 * An error with an HTTP status and a stable machine-readable code. Route handlers throw these; the
 * error handler turns them into `{ error: { code, message, fields? } }`.
 */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
    this.name = 'HttpError';
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) =>
  new HttpError(400, 'validation_error', message, fields);

export const unauthorized = (message = 'Sign in to continue.') => new HttpError(401, 'unauthenticated', message);

export const invalidCredentials = () =>
  new HttpError(401, 'invalid_credentials', 'The e-mail address or password is not correct.');

export const forbidden = (message = 'Your role may not do this.') => new HttpError(403, 'forbidden', message);

export const notFound = (what = 'The resource') => new HttpError(404, 'not_found', `${what} was not found.`);

export const conflict = (message: string, details?: Record<string, unknown>) =>
  new HttpError(409, 'conflict', message, undefined, details);

export const staleVersion = (what: string, currentVersion: number) =>
  new HttpError(
    409,
    'stale_version',
    `${what} was changed by someone else since you loaded it (now at version ${currentVersion}). Reload and try again.`,
    undefined,
    { currentVersion },
  );

export const payloadTooLarge = (message: string) => new HttpError(413, 'payload_too_large', message);

export const tooManyRequests = (message: string) => new HttpError(429, 'rate_limited', message);
