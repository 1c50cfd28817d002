import { z } from 'zod';
import type { AuditEventDto } from './audit';
import type { CampaignDto } from './campaign';
import type { VariantListRowDto } from './variant';

/** How many of a campaign's best variants the Overview lists. */
export const overviewBestVariantCount = 5;
/** How many of a campaign's latest audit events the Overview lists. */
export const overviewActivityCount = 8;

/** Query string of `GET /api/overview`: it takes no parameters, and says so rather than ignoring a typo. */
export const overviewQuery = z.strictObject(
  {},
  {
    error: (issue) =>
      issue.code === 'unrecognized_keys'
        ? `unknown parameter ${issue.keys.map((key) => `'${key}'`).join(', ')}; the overview takes no parameters`
        : undefined,
  },
);

/** An audit event with the variant it concerns (for variant, assay, measurement and pH-profile events). */
export interface OverviewActivityDto extends AuditEventDto {
  variant: { id: number; label: string } | null;
}

/** One campaign as the Overview shows it. */
export interface CampaignOverviewDto {
  campaign: CampaignDto;
  /** Submitted measurements not superseded by a refit: the ones a lead can approve or flag. */
  awaitingReview: number;
  /**
   * Variants (not the parent) with a ΔΔG‡ for kcat/Km against the condition-matched parent, most
   * negative (most improved) first.
   */
  bestVariants: VariantListRowDto[];
  /** Newest first. */
  recentActivity: OverviewActivityDto[];
}

/** `GET /api/overview`: active campaigns first, then paused, then closed; by name within each. */
export interface OverviewDto {
  campaigns: CampaignOverviewDto[];
}
