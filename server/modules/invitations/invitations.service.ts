import { IsNull, type DataSource, type EntityManager } from 'typeorm';
import type { SessionUserDto } from '@shared/schemas/auth';
import {
  invitationLifetimeHours,
  type AcceptInvitationInput,
  type CreateInvitationInput,
  type InvitationDto,
  type InvitationLookupDto,
  type InvitationStatus,
} from '@shared/schemas/invitation';
import { conflict, HttpError, notFound, staleVersion } from '../../http/errors';
import { writeTransaction } from '../../write-transaction';
import { recordAudit } from '../audit/record-audit';
import { enqueueMail } from '../mail/enqueue-mail';
import { hashLinkToken, newLinkToken } from '../mail/link-token';
import type { MailOptions } from '../mail/mail-options';
import { hashPassword } from '../users/password';
import { User } from '../users/user.entity';
import { toSessionUser } from '../users/users.service';
import { Invitation } from './invitation.entity';
import { renderInvitationMail } from './invitation-mail';

/** Audit entity type written by this module. */
export const invitationAuditType = 'invitation';

const lifetimeMs = invitationLifetimeHours * 60 * 60 * 1000;

/** Client path of the acceptance page; the token follows as `?token=`. */
export const invitationPagePath = '/invitation';

/**
 * Invites an address with a role: refuses an address that already has an account (409), withdraws
 * earlier pending invitations of the same address (only the newest link works), stores the new one with
 * the hash of its token and queues the message, all in one transaction.
 *
 * @param dataSource the data source
 * @param mail mail options (link base, sender, time zone, delivery)
 * @param actor the inviting admin
 * @param input address and role
 * @returns the invitation DTO
 */
export async function createInvitation(
  dataSource: DataSource,
  mail: MailOptions,
  actor: { id: number; name: string },
  input: CreateInvitationInput,
): Promise<InvitationDto> {
  const { token, hash } = newLinkToken();
  const invitation = await writeTransaction(dataSource, async (manager) => {
    if (await manager.getRepository(User).existsBy({ email: input.email })) {
      throw conflict(`${input.email} already has an account; change its role on the users page instead.`);
    }
    const repository = manager.getRepository(Invitation);
    const now = new Date();
    for (const earlier of await repository.findBy({ email: input.email, acceptedAt: IsNull(), revokedAt: IsNull() })) {
      if (earlier.expiresAt <= now) continue;
      earlier.revokedAt = now;
      await repository.save(earlier);
      await recordAudit(manager, { actorId: actor.id, entityType: invitationAuditType, entityId: earlier.id, action: 'revoke', after: { reason: 'replaced by a new invitation' } });
    }
    const saved = await repository.save(
      repository.create({
        email: input.email,
        role: input.role,
        tokenHash: hash,
        invitedById: actor.id,
        expiresAt: new Date(now.getTime() + lifetimeMs),
        acceptedAt: null,
        acceptedUserId: null,
        revokedAt: null,
      }),
    );
    const message = renderInvitationMail(
      { email: saved.email, role: saved.role, inviterName: actor.name, url: `${mail.publicUrl}${invitationPagePath}?token=${token}`, expiresAt: saved.expiresAt },
      mail,
    );
    await enqueueMail(manager, { kind: 'invitation', to: saved.email, toName: null, from: mail.from, ...message });
    await recordAudit(manager, {
      actorId: actor.id,
      entityType: invitationAuditType,
      entityId: saved.id,
      action: 'create',
      after: { id: saved.id, email: saved.email, role: saved.role, expiresAt: saved.expiresAt.toISOString() },
    });
    return saved;
  });
  mail.delivery?.kick();
  return toInvitationDto(invitation, actor);
}

/**
 * Every invitation, newest first, with its status.
 *
 * @param dataSource the data source
 * @returns the DTOs
 */
export async function listInvitations(dataSource: DataSource): Promise<InvitationDto[]> {
  const invitations = await dataSource.getRepository(Invitation).find({ relations: { invitedBy: true }, order: { id: 'DESC' }, take: 500 });
  return invitations.map((invitation) => toInvitationDto(invitation, invitation.invitedBy));
}

/**
 * Withdraws a pending invitation so its link stops working; refuses a stale version (409) and an
 * invitation that is no longer pending (409).
 *
 * @param dataSource the data source
 * @param actorId the admin
 * @param id the invitation
 * @param version the version the admin saw
 * @returns the updated DTO
 */
export async function revokeInvitation(dataSource: DataSource, actorId: number, id: number, version: number): Promise<InvitationDto> {
  return writeTransaction(dataSource, async (manager) => {
    const repository = manager.getRepository(Invitation);
    const invitation = await repository.findOne({ where: { id }, relations: { invitedBy: true } });
    if (!invitation) throw notFound('The invitation');
    if (invitation.version !== version) throw staleVersion('This invitation', invitation.version);
    const status = statusOf(invitation, new Date());
    if (status !== 'pending') throw new HttpError(409, 'invalid_transition', `This invitation is ${status}; only a pending invitation can be withdrawn.`);
    invitation.revokedAt = new Date();
    const saved = await repository.save(invitation);
    await recordAudit(manager, { actorId, entityType: invitationAuditType, entityId: id, action: 'revoke', after: { id, email: invitation.email } });
    return toInvitationDto(saved, invitation.invitedBy);
  });
}

/**
 * What an invitation link is for, before the invitee fills in the form; 400 `invalid_token` for a link
 * that is unknown, expired, used or withdrawn.
 *
 * @param dataSource the data source
 * @param token the token from the link
 * @returns address, role, inviter and expiry
 */
export async function lookupInvitation(dataSource: DataSource, token: string): Promise<InvitationLookupDto> {
  const invitation = await usableInvitation(dataSource.manager, token);
  return { email: invitation.email, role: invitation.role, invitedBy: invitation.invitedBy?.name ?? null, expiresAt: invitation.expiresAt.toISOString() };
}

/**
 * Accepts an invitation: creates the account with the invited address and role and the chosen name and
 * password, and marks the invitation used, in one transaction. 400 `invalid_token` for a link that no
 * longer works; 409 when the address got an account meanwhile.
 *
 * @param dataSource the data source
 * @param input token, name and password
 * @returns the new user, to sign in
 */
export async function acceptInvitation(dataSource: DataSource, input: AcceptInvitationInput): Promise<SessionUserDto> {
  // Hashing takes tens of milliseconds; it happens before the transaction so no other write waits for it.
  const passwordHash = await hashPassword(input.password);
  return writeTransaction(dataSource, async (manager) => {
    const invitation = await usableInvitation(manager, input.token);
    const users = manager.getRepository(User);
    if (await users.existsBy({ email: invitation.email })) {
      throw conflict(`${invitation.email} already has an account; sign in or ask for a password reset.`);
    }
    const user = await users.save(
      users.create({ email: invitation.email, name: input.name, role: invitation.role, passwordHash, active: true, lastSignInAt: null, preferences: {} }),
    );
    invitation.acceptedAt = new Date();
    invitation.acceptedUserId = user.id;
    const { invitedBy: _invitedBy, ...columns } = invitation;
    await manager.getRepository(Invitation).save(manager.getRepository(Invitation).create(columns));
    await recordAudit(manager, {
      actorId: user.id,
      entityType: invitationAuditType,
      entityId: invitation.id,
      action: 'accept',
      after: { id: invitation.id, userId: user.id, email: user.email, role: user.role },
    });
    return toSessionUser(user);
  });
}

async function usableInvitation(manager: EntityManager, token: string): Promise<Invitation & { invitedBy: User | null }> {
  const invitation = await manager.getRepository(Invitation).findOne({ where: { tokenHash: hashLinkToken(token) }, relations: { invitedBy: true } });
  if (!invitation) throw invalidInvitation('This invitation link is not valid. Ask an admin to send you a new one.', 'is not a valid invitation link');
  const status = statusOf(invitation, new Date());
  if (status === 'accepted') throw invalidInvitation('This invitation was already used. Sign in with the password you chose.', 'was already used');
  if (status === 'revoked') throw invalidInvitation('This invitation was withdrawn. Ask an admin to send you a new one.', 'was withdrawn');
  if (status === 'expired') throw invalidInvitation(`This invitation expired (links work for ${invitationLifetimeHours} hours). Ask an admin to send you a new one.`, 'has expired');
  return invitation;
}

function invalidInvitation(message: string, field: string): HttpError {
  return new HttpError(400, 'invalid_token', message, { token: field });
}

function statusOf(invitation: Invitation, now: Date): InvitationStatus {
  if (invitation.acceptedAt) return 'accepted';
  if (invitation.revokedAt) return 'revoked';
  return invitation.expiresAt <= now ? 'expired' : 'pending';
}

function toInvitationDto(invitation: Invitation, invitedBy: { id: number; name: string } | null): InvitationDto {
  return {
    id: invitation.id,
    email: invitation.email,
    role: invitation.role,
    status: statusOf(invitation, new Date()),
    invitedBy: invitedBy ? { id: invitedBy.id, name: invitedBy.name } : null,
    expiresAt: invitation.expiresAt.toISOString(),
    acceptedAt: invitation.acceptedAt?.toISOString() ?? null,
    createdAt: invitation.createdAt.toISOString(),
    version: invitation.version,
  };
}
