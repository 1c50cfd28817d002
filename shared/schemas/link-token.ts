import { z } from 'zod';

/** Characters of a link token: 32 random bytes in base64url without padding. */
export const linkTokenLength = 43;

/**
 * The secret in an invitation, password-reset or unsubscribe link. Checked for shape only, so that a
 * mangled link gets a clear message before any lookup.
 */
export const linkTokenInput = z
  .string({ error: 'is required (open the link from the e-mail again)' })
  .trim()
  .regex(new RegExp(`^[A-Za-z0-9_-]{${linkTokenLength}}$`), 'is not a valid link; copy the whole link from the e-mail');

/** Query string of the pages that look a token up before using it. */
export const linkTokenQuery = z.object({ token: linkTokenInput });
export type LinkTokenQuery = z.infer<typeof linkTokenQuery>;
