import { z } from 'zod';
import { emailInput, newPasswordInput } from './auth';
import { linkTokenInput } from './link-token';

/** How long a password-reset link works. */
export const passwordResetLifetimeMinutes = 60;

/**
 * The one answer to every reset request, whether or not the address has an account, so that the form
 * cannot be used to find out who has one.
 */
export const passwordResetRequestedMessage =
  'If an account exists for that address, we sent it a message with a link to set a new password. The link works for one hour.';

/** Body of POST /api/password-resets. */
export const requestPasswordResetInput = z.object({ email: emailInput });
export type RequestPasswordResetInput = z.infer<typeof requestPasswordResetInput>;

/** Body of POST /api/password-resets/complete. */
export const completePasswordResetInput = z.object({ token: linkTokenInput, newPassword: newPasswordInput });
export type CompletePasswordResetInput = z.infer<typeof completePasswordResetInput>;

/** GET /api/password-resets/lookup: whether the link still works. */
export interface PasswordResetLookupDto {
  email: string;
  expiresAt: string;
}
