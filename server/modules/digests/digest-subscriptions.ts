import { randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { DigestSubscriberDto, DigestSubscriptionStateDto, UnsubscribeLookupDto, UpdateDigestSubscriptionInput } from '@shared/schemas/digest';
import { HttpError, notFound, staleVersion } from '../../http/errors';
import { writeTransaction } from '../../write-transaction';
import { recordAudit } from '../audit/record-audit';
import { DigestSubscription } from './digest-subscription.entity';

/** Audit entity type of subscription changes. */
export const subscriptionAuditType = 'digest-subscription';

/** Someone who receives a campaign's digest now. */
export interface DigestRecipientRow {
  userId: number;
  email: string;
  name: string;
  role: string;
  /** null for a lead subscribed by default, who has no row (and so no unsubscribe token) yet. */
  subscriptionId: number | null;
  unsubscribeToken: string | null;
  isLead: boolean;
}

/** A fresh unsubscribe token: 32 random bytes, base64url (the shape linkTokenInput accepts). */
export function newUnsubscribeToken(): string {
  return randomBytes(32).toString('base64url');
}

/**
 * Who receives a campaign's digest now: active users with an active subscription, and the campaign's lead
 * unless the lead has a subscription row (an inactive one means the lead unsubscribed). With
 * `createLeadRow` (inside a run's transaction) a lead without a row gets one, so the message can carry an
 * unsubscribe link.
 *
 * @param manager entity manager (the run's transaction when `createLeadRow`)
 * @param campaignId the campaign
 * @param options.createLeadRow write the lead's default subscription
 * @returns the recipients, by name
 */
export async function currentRecipients(manager: EntityManager, campaignId: number, options: { createLeadRow: boolean }): Promise<DigestRecipientRow[]> {
  const [campaign] = (await manager.query(`SELECT lead_id FROM campaigns WHERE id = ?`, [campaignId])) as { lead_id: number | null }[];
  const leadId = campaign?.lead_id ?? null;
  const [defaultLead] = (await manager.query(
    `SELECT u.id, u.email, u.name, u.role FROM campaigns c JOIN users u ON u.id = c.lead_id
      WHERE c.id = ? AND u.active = 1
        AND NOT EXISTS (SELECT 1 FROM digest_subscriptions s WHERE s.campaign_id = c.id AND s.user_id = c.lead_id)`,
    [campaignId],
  )) as { id: number; email: string; name: string; role: string }[];
  if (defaultLead && options.createLeadRow) {
    await manager.getRepository(DigestSubscription).insert({ campaignId, userId: defaultLead.id, active: true, unsubscribeToken: newUnsubscribeToken() });
  }
  const rows = (await manager.query(
    `SELECT s.id AS subscription_id, s.unsubscribe_token, u.id AS user_id, u.email, u.name, u.role
       FROM digest_subscriptions s JOIN users u ON u.id = s.user_id
      WHERE s.campaign_id = ? AND s.active = 1 AND u.active = 1`,
    [campaignId],
  )) as { subscription_id: number; unsubscribe_token: string; user_id: number; email: string; name: string; role: string }[];
  const recipients: DigestRecipientRow[] = rows.map((row) => ({
    userId: row.user_id,
    email: row.email,
    name: row.name,
    role: row.role,
    subscriptionId: row.subscription_id,
    unsubscribeToken: row.unsubscribe_token,
    isLead: row.user_id === leadId,
  }));
  if (defaultLead && !options.createLeadRow) {
    recipients.push({ userId: defaultLead.id, email: defaultLead.email, name: defaultLead.name, role: defaultLead.role, subscriptionId: null, unsubscribeToken: null, isLead: true });
  }
  return recipients.sort((first, second) => first.name.localeCompare(second.name) || first.userId - second.userId);
}

/**
 * A campaign's current recipients as the Digests page lists them.
 *
 * @param dataSource the data source
 * @param campaignId the campaign
 * @returns the subscribers; 404 for an unknown campaign
 */
export async function listSubscribers(dataSource: DataSource, campaignId: number): Promise<DigestSubscriberDto[]> {
  await requireCampaign(dataSource.manager, campaignId);
  const recipients = await currentRecipients(dataSource.manager, campaignId, { createLeadRow: false });
  return recipients.map((recipient) => ({ userId: recipient.userId, name: recipient.name, email: recipient.email, role: recipient.role, byDefault: recipient.subscriptionId === null }));
}

/**
 * One user's subscription state for a campaign.
 *
 * @param manager entity manager
 * @param campaignId the campaign
 * @param userId the user
 * @param leadId the campaign's lead
 * @returns subscribed, by default or not, and the row's version
 */
export async function subscriptionState(manager: EntityManager, campaignId: number, userId: number, leadId: number | null): Promise<DigestSubscriptionStateDto> {
  const row = await manager.getRepository(DigestSubscription).findOneBy({ campaignId, userId });
  if (!row) return { subscribed: leadId === userId, byDefault: leadId === userId, version: null };
  return { subscribed: row.active, byDefault: false, version: row.version };
}

/**
 * Subscribes or unsubscribes the signed-in user. `version` is the row's version as loaded, or null when
 * there was no row; anything else is a 409 `stale_version`. The change is audited.
 *
 * @param dataSource the data source
 * @param userId the signed-in user
 * @param campaignId the campaign; 404 when unknown
 * @param input subscribed and version
 * @returns the new state
 */
export async function updateOwnSubscription(
  dataSource: DataSource,
  userId: number,
  campaignId: number,
  input: UpdateDigestSubscriptionInput,
): Promise<DigestSubscriptionStateDto> {
  return writeTransaction(dataSource, async (manager) => {
    const leadId = await requireCampaign(manager, campaignId);
    const repository = manager.getRepository(DigestSubscription);
    let row = await repository.findOneBy({ campaignId, userId });
    if (row) {
      if (input.version !== row.version) throw staleVersion('Your subscription', row.version);
      row.active = input.subscribed;
      row = await repository.save(row);
    } else {
      if (input.version !== null) {
        throw new HttpError(409, 'stale_version', 'Your subscription changed since you loaded it. Reload and try again.', undefined, { currentVersion: null });
      }
      row = await repository.save(repository.create({ campaignId, userId, active: input.subscribed, unsubscribeToken: newUnsubscribeToken() }));
    }
    await recordAudit(manager, {
      actorId: userId,
      entityType: subscriptionAuditType,
      entityId: row.id,
      campaignId,
      action: input.subscribed ? 'subscribe' : 'unsubscribe',
      after: { campaignId, userId, active: row.active, version: row.version },
    });
    return subscriptionState(manager, campaignId, userId, leadId);
  });
}

/**
 * What an unsubscribe link is for; 400 `invalid_token` for an unknown token.
 *
 * @param dataSource the data source
 * @param token the token from the link
 * @returns the campaign, the address and whether it is still subscribed
 */
export async function lookupUnsubscribe(dataSource: DataSource, token: string): Promise<UnsubscribeLookupDto> {
  const [row] = (await dataSource.query(
    `SELECT s.active, c.id AS campaign_id, c.name AS campaign_name, u.email
       FROM digest_subscriptions s JOIN campaigns c ON c.id = s.campaign_id JOIN users u ON u.id = s.user_id
      WHERE s.unsubscribe_token = ?`,
    [token],
  )) as { active: number; campaign_id: number; campaign_name: string; email: string }[];
  if (!row) throw invalidUnsubscribeToken();
  return { campaign: { id: row.campaign_id, name: row.campaign_name }, email: row.email, subscribed: row.active === 1 };
}

/**
 * Unsubscribes the holder of an unsubscribe link (idempotent: a second use changes nothing); 400
 * `invalid_token` for an unknown token. Audited with the subscriber as the actor.
 *
 * @param dataSource the data source
 * @param token the token from the link or the List-Unsubscribe header
 * @returns the state after the change
 */
export async function unsubscribeWithToken(dataSource: DataSource, token: string): Promise<UnsubscribeLookupDto> {
  await writeTransaction(dataSource, async (manager) => {
    const repository = manager.getRepository(DigestSubscription);
    const row = await repository.findOneBy({ unsubscribeToken: token });
    if (!row) throw invalidUnsubscribeToken();
    if (!row.active) return;
    row.active = false;
    const saved = await repository.save(row);
    await recordAudit(manager, {
      actorId: row.userId,
      entityType: subscriptionAuditType,
      entityId: row.id,
      campaignId: row.campaignId,
      action: 'unsubscribe',
      after: { campaignId: row.campaignId, userId: row.userId, active: false, version: saved.version, via: 'link' },
    });
  });
  return lookupUnsubscribe(dataSource, token);
}

/** 404 unless the campaign exists; returns its lead. */
export async function requireCampaign(manager: EntityManager, campaignId: number): Promise<number | null> {
  const [campaign] = (await manager.query(`SELECT lead_id FROM campaigns WHERE id = ?`, [campaignId])) as { lead_id: number | null }[];
  if (!campaign) throw notFound('The campaign');
  return campaign.lead_id;
}

function invalidUnsubscribeToken(): HttpError {
  return new HttpError(400, 'invalid_token', 'This unsubscribe link is not valid. Change your subscriptions on the Digests page instead.', {
    token: 'is not a valid unsubscribe link',
  });
}
