import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';

const windowMs = 15 * 60 * 1000;
const maxFailures = 10;

const message = {
  error: { code: 'rate_limited', message: 'Too many failed sign-in attempts. Wait 15 minutes and try again.' },
};

/**
 * Two counters of failed sign-ins, one per client address and one per account e-mail, so neither
 * guessing many passwords for one account nor one account from many addresses goes unchecked.
 */
export function signInLimits(): RequestHandler[] {
  const common = { windowMs, limit: maxFailures, skipSuccessfulRequests: true, standardHeaders: 'draft-8', legacyHeaders: false, message } as const;
  return [
    rateLimit({ ...common, keyGenerator: (req) => `ip:${ipKeyGenerator(req.ip ?? 'unknown')}` }),
    rateLimit({
      ...common,
      keyGenerator: (req) => {
        const email: unknown = req.body?.email;
        return `account:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
      },
    }),
  ];
}
