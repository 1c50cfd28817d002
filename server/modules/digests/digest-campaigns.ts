import type { DataSource } from 'typeorm';
import type { CampaignStatus } from '@shared/schemas/campaign';
import type { DigestCampaignListDto } from '@shared/schemas/digest';
import type { MailOptions } from '../mail/mail-options';
import { listDigestRuns } from './digest-runs';
import { nextDigestSlot } from './digest-schedule';
import { loadDigestSettings } from './digest-settings';
import { currentRecipients, subscriptionState } from './digest-subscriptions';

/**
 * The Digests page's overview: the schedule, and for every campaign its settings, the signed-in user's
 * subscription, how many people receive it and its latest run.
 *
 * @param dataSource the data source
 * @param mail mail options (schedule and time zone)
 * @param userId the signed-in user
 * @returns the schedule and the campaigns, by name
 */
export async function listDigestCampaigns(dataSource: DataSource, mail: MailOptions, userId: number): Promise<DigestCampaignListDto> {
  const campaigns = (await dataSource.query(
    `SELECT c.id, c.name, c.status, c.lead_id, u.name AS lead_name FROM campaigns c LEFT JOIN users u ON u.id = c.lead_id ORDER BY c.name COLLATE NOCASE, c.id`,
  )) as { id: number; name: string; status: CampaignStatus; lead_id: number | null; lead_name: string | null }[];
  const manager = dataSource.manager;
  const schedule = { ...mail.digestSchedule, timezone: mail.timezone };
  return {
    schedule: { ...schedule, nextRunAt: nextDigestSlot(schedule, new Date())?.toISOString() ?? null },
    campaigns: await Promise.all(
      campaigns.map(async (campaign) => ({
        campaign: {
          id: campaign.id,
          name: campaign.name,
          status: campaign.status,
          lead: campaign.lead_id === null ? null : { id: campaign.lead_id, name: campaign.lead_name ?? '' },
        },
        settings: await loadDigestSettings(manager, campaign.id),
        subscription: await subscriptionState(manager, campaign.id, userId, campaign.lead_id),
        subscriberCount: (await currentRecipients(manager, campaign.id, { createLeadRow: false })).length,
        lastRun: (await listDigestRuns(dataSource, { campaignId: campaign.id, page: 1, pageSize: 1 })).rows[0] ?? null,
      })),
    ),
  };
}
