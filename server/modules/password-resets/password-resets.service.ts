import { IsNull, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUserDto } from '@shared/schemas/auth';
import { passwordResetLifetimeMinutes, type CompletePasswordResetInput, type PasswordResetLookupDto } from '@shared/schemas/password-reset';
import { HttpError } from '../../http/errors';
import { writeTransaction } from '../../write-transaction';
import { recordAudit } from '../audit/record-audit';
import { enqueueMail } from '../mail/enqueue-mail';
import { hashLinkToken, newLinkToken } from '../mail/link-token';
import type { MailOptions } from '../mail/mail-options';
import { SessionRecord } from '../sessions/session.entity';
import { hashPassword } from '../users/password';
import { User } from '../users/user.entity';
import { toSessionUser } from '../users/users.service';
import { PasswordReset } from './password-reset.entity';
import { renderPasswordResetMail } from './password-reset-mail';

const lifetimeMs = passwordResetLifetimeMinutes * 60 * 1000;

/** Client path of the page that sets the new password; the token follows as `?token=`. */
export const resetPasswordPagePath = '/reset-password';

/**
 * Sends a reset link to the address if it belongs to an active account, and does nothing otherwise; the
 * caller answers the same either way. The token's hash and the message are written in one transaction.
 *
 * @param dataSource the data source
 * @param mail mail options
 * @param email the address asked for (lower-cased by the schema)
 * @returns whether a message was queued (for the server log and tests, never for the response)
 */
export async function requestPasswordReset(dataSource: DataSource, mail: MailOptions, email: string): Promise<boolean> {
  const { token, hash } = newLinkToken();
  const queued = await writeTransaction(dataSource, async (manager) => {
    const user = await manager.getRepository(User).findOneBy({ email, active: true });
    if (!user) return false;
    const repository = manager.getRepository(PasswordReset);
    const reset = await repository.save(repository.create({ userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + lifetimeMs), usedAt: null }));
    const message = renderPasswordResetMail({ name: user.name, url: `${mail.publicUrl}${resetPasswordPagePath}?token=${token}`, expiresAt: reset.expiresAt }, mail);
    await enqueueMail(manager, { kind: 'password-reset', to: user.email, toName: user.name, from: mail.from, ...message });
    return true;
  });
  if (queued) mail.delivery?.kick();
  return queued;
}

/**
 * Whether a reset link still works, before the user types a new password; 400 `invalid_token` otherwise.
 *
 * @param dataSource the data source
 * @param token the token from the link
 * @returns the account's address and the link's expiry
 */
export async function lookupPasswordReset(dataSource: DataSource, token: string): Promise<PasswordResetLookupDto> {
  const { reset, user } = await usableReset(dataSource.manager, token);
  return { email: user.email, expiresAt: reset.expiresAt.toISOString() };
}

/**
 * Sets the new password from a reset link. In one transaction: the password changes, this link and every
 * other open reset link of the account stop working, and all of the user's sessions end. 400
 * `invalid_token` for a link that is unknown, used or expired.
 *
 * @param dataSource the data source
 * @param input token and new password
 * @returns the user, to sign in on the caller's fresh session
 */
export async function completePasswordReset(dataSource: DataSource, input: CompletePasswordResetInput): Promise<SessionUserDto> {
  // Hashing takes tens of milliseconds; it happens before the transaction so no other write waits for it.
  const passwordHash = await hashPassword(input.newPassword);
  return writeTransaction(dataSource, async (manager) => {
    const { user } = await usableReset(manager, input.token);
    user.passwordHash = passwordHash;
    const saved = await manager.getRepository(User).save(user);
    await manager.getRepository(PasswordReset).update({ userId: user.id, usedAt: IsNull() }, { usedAt: new Date() });
    await manager.getRepository(SessionRecord).delete({ userId: user.id });
    await recordAudit(manager, { actorId: user.id, entityType: 'user', entityId: user.id, action: 'password-reset', after: { id: user.id, email: user.email } });
    return toSessionUser(saved);
  });
}

async function usableReset(manager: EntityManager, token: string): Promise<{ reset: PasswordReset; user: User }> {
  const reset = await manager.getRepository(PasswordReset).findOne({ where: { tokenHash: hashLinkToken(token) }, relations: { user: true } });
  if (!reset || !reset.user.active) throw invalidReset('This password-reset link is not valid. Ask for a new one on the sign-in page.', 'is not a valid reset link');
  if (reset.usedAt) throw invalidReset('This password-reset link was already used. Ask for a new one on the sign-in page.', 'was already used');
  if (reset.expiresAt <= new Date()) {
    throw invalidReset(`This password-reset link expired (links work for ${passwordResetLifetimeMinutes} minutes). Ask for a new one on the sign-in page.`, 'has expired');
  }
  const { user, ...columns } = reset;
  return { reset: Object.assign(new PasswordReset(), columns), user };
}

function invalidReset(message: string, field: string): HttpError {
  return new HttpError(400, 'invalid_token', message, { token: field });
}
