import type { DataSource } from 'typeorm';
import type { AuditEventDto } from '@shared/schemas/audit';
import { campaignStatuses, type CampaignDto } from '@shared/schemas/campaign';
import {
  overviewActivityCount,
  overviewBestVariantCount,
  type CampaignOverviewDto,
  type OverviewActivityDto,
  type OverviewDto,
} from '@shared/schemas/overview';
import { listVariantsQuery } from '@shared/schemas/variant';
import { listAuditEvents } from '../audit/audit.service';
import { listCampaigns } from '../campaigns/campaigns.service';
import { listVariants } from '../variants/list-variants';

// Audit entity types whose snapshots name the variant they belong to as `variantId`.
const variantOwnedEntityTypes: readonly string[] = ['assay', 'measurement', 'ph-profile'];

/**
 * The home page in one read: every campaign with its variant counts, the submitted measurements waiting
 * for review, its best variants by ΔΔG‡ against the condition-matched parent and its latest audit events
 * with the variant each concerns. Each campaign costs a few indexed queries (the variant list on the
 * ΔΔG‡ index, the audit trail on `(campaign_id, at)`), and the review counts are one grouped query.
 *
 * @param dataSource the application's data source
 * @returns active campaigns first, then paused, then closed
 */
export async function getOverview(dataSource: DataSource): Promise<OverviewDto> {
  const { rows } = await listCampaigns(dataSource);
  const campaigns = [...rows].sort((a, b) => campaignStatuses.indexOf(a.status) - campaignStatuses.indexOf(b.status));
  const waiting = await awaitingReviewByCampaign(dataSource);
  const overviews: CampaignOverviewDto[] = [];
  for (const campaign of campaigns) overviews.push(await campaignOverview(dataSource, campaign, waiting.get(campaign.id) ?? 0));
  return { campaigns: overviews };
}

async function campaignOverview(dataSource: DataSource, campaign: CampaignDto, awaitingReview: number): Promise<CampaignOverviewDto> {
  // One row more than shown, since the parent (ΔΔG‡ 0 against itself) may be among them.
  const best = await listVariants(
    dataSource,
    listVariantsQuery.parse({ campaignId: campaign.id, sort: 'ddg', order: 'asc', pageSize: overviewBestVariantCount + 1 }),
  );
  const bestVariants = best.rows.filter((row) => !row.isParent && row.ddg !== null).slice(0, overviewBestVariantCount);
  const audit = await listAuditEvents(dataSource, { campaignId: campaign.id, page: 1, pageSize: overviewActivityCount });
  return { campaign, awaitingReview, bestVariants, recentActivity: await withVariants(dataSource, audit.rows) };
}

async function awaitingReviewByCampaign(dataSource: DataSource): Promise<Map<number, number>> {
  // Driven from the (review_state, created_at) index: submitted measurements are few next to approved ones.
  const counts: { campaign_id: number; n: number }[] = await dataSource.query(
    `SELECT v.campaign_id, COUNT(*) AS n
       FROM measurements m JOIN variants v ON v.id = m.variant_id
      WHERE m.review_state = 'submitted' AND m.superseded_by_id IS NULL
      GROUP BY v.campaign_id`,
  );
  return new Map(counts.map((row) => [row.campaign_id, Number(row.n)]));
}

function variantIdOf(event: AuditEventDto): number | null {
  if (event.entityType === 'variant') return event.entityId;
  if (!variantOwnedEntityTypes.includes(event.entityType)) return null;
  for (const snapshot of [event.after, event.before]) {
    if (typeof snapshot === 'object' && snapshot !== null && 'variantId' in snapshot && typeof snapshot.variantId === 'number') {
      return snapshot.variantId;
    }
  }
  return null;
}

async function withVariants(dataSource: DataSource, events: readonly AuditEventDto[]): Promise<OverviewActivityDto[]> {
  const ids = [...new Set(events.map(variantIdOf).filter((id): id is number => id !== null))];
  const labels = new Map<number, string>();
  if (ids.length > 0) {
    const rows: { id: number; label: string }[] = await dataSource.query(
      `SELECT id, label FROM variants WHERE id IN (${ids.map(() => '?').join(', ')})`,
      ids,
    );
    for (const row of rows) labels.set(row.id, row.label);
  }
  return events.map((event) => {
    const id = variantIdOf(event);
    const label = id === null ? undefined : labels.get(id);
    return { ...event, variant: id === null || label === undefined ? null : { id, label } };
  });
}
