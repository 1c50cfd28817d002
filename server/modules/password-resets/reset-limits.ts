import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';

const windowMs = 60 * 60 * 1000;
/** Requests per address per hour: enough for typos, too few to flood an inbox. */
const maxPerAddress = 3;
/** Requests per client per hour: a shared office network still gets through. */
const maxPerClient = 20;

const message = {
  error: { code: 'rate_limited', message: 'Too many password-reset requests. Wait an hour and try again.' },
};

/**
 * Limits on reset requests, counted whether or not the address has an account (so the limit itself
 * reveals nothing): per e-mail address, so nobody's inbox is flooded, and per client address.
 */
export function passwordResetLimits(): RequestHandler[] {
  const common = { windowMs, standardHeaders: 'draft-8', legacyHeaders: false, message } as const;
  return [
    rateLimit({ ...common, limit: maxPerClient, keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? 'unknown')}` }),
    rateLimit({
      ...common,
      limit: maxPerAddress,
      keyGenerator: (req) => {
        const email: unknown = req.body?.email;
        return `account:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
      },
    }),
  ];
}
