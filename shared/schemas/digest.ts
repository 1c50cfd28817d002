import { z } from 'zod';
import type { CampaignStatus, PersonRefDto } from './campaign';
import { linkTokenInput } from './link-token';
import type { OutboxStatus } from './mail';
import type { VariantStatus } from './variant';

/** Days of the week in the order cron numbers them (Sunday = 0). */
export const digestDays = ['sunday', 'monday', 'tuesday', 'wednesday', 'thursday', 'friday', 'saturday'] as const;
export type DigestDay = (typeof digestDays)[number];

/** The review states a digest may rank on; drafts never count in a digest. */
export const digestReviewStates = ['submitted', 'approved'] as const;
export type DigestReviewState = (typeof digestReviewStates)[number];

/** Most variants a digest lists in its ranking. */
export const maxDigestTopCount = 50;

/** What a campaign's digest uses until its lead changes it. */
export const defaultDigestSettings: { reviewStates: DigestReviewState[]; topCount: number } = {
  reviewStates: ['submitted', 'approved'],
  topCount: 10,
};

const version = (what: string) =>
  z
    .number({ error: `is required (the version you loaded, or null when there was no ${what} yet)` })
    .int('must be a whole number')
    .min(1, 'must be at least 1')
    .nullable();

/** Body of PUT /api/digests/campaigns/:id/settings. `version` is null while the campaign uses the defaults. */
export const updateDigestSettingsInput = z.object({
  version: version('saved setting'),
  reviewStates: z
    .array(z.enum(digestReviewStates, { error: `must be one of ${digestReviewStates.join(', ')}` }), {
      error: 'must be a list of review states',
    })
    .min(1, 'choose at least one review state')
    .transform((states) => digestReviewStates.filter((state) => states.includes(state))),
  topCount: z
    .number({ error: 'must be a number' })
    .int('must be a whole number')
    .min(1, `must be from 1 to ${maxDigestTopCount}`)
    .max(maxDigestTopCount, `must be from 1 to ${maxDigestTopCount}`),
});
export type UpdateDigestSettingsInput = z.infer<typeof updateDigestSettingsInput>;

/** Body of PUT /api/digests/campaigns/:id/subscription: the signed-in user's own subscription. */
export const updateDigestSubscriptionInput = z.object({
  subscribed: z.boolean({ error: 'must be true or false' }),
  version: version('subscription'),
});
export type UpdateDigestSubscriptionInput = z.infer<typeof updateDigestSubscriptionInput>;

/** Body of POST /api/digests/unsubscribe (the token may instead come in the query, as the one-click header sends it). */
export const unsubscribeInput = z.object({ token: linkTokenInput });
export type UnsubscribeInput = z.infer<typeof unsubscribeInput>;

const queryId = z.coerce.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1');

/** Query of GET /api/digests/runs. */
export const digestRunListQuery = z.object({
  campaignId: queryId.optional(),
  page: queryId.default(1),
  pageSize: queryId.max(100, 'must be at most 100').default(20),
});
export type DigestRunListQuery = z.infer<typeof digestRunListQuery>;

/** Plain words for the flag codes a digest lists. */
export const digestFlagLabels: Record<string, string> = {
  'above-diffusion-limit': 'kcat/Km above the diffusion limit',
  'near-diffusion-limit': 'kcat/Km near the diffusion limit',
  'km-above-range': 'Km above the highest substrate concentration tested',
  'range-does-not-span-km': 'substrate range does not span 0.2–5 × Km',
  'poorly-determined': 'poorly determined (large standard error)',
  'incomplete-reporting': 'incomplete reporting (STRENDA items missing)',
};

/** When the weekly digest goes out. */
export interface DigestScheduleDto {
  day: DigestDay;
  hour: number;
  timezone: string;
  /** The next scheduled run, ISO 8601. */
  nextRunAt: string | null;
}

export interface DigestSettingsDto {
  campaignId: number;
  reviewStates: DigestReviewState[];
  topCount: number;
  /** null while the campaign uses the defaults. */
  version: number | null;
  updatedAt: string | null;
}

/** The signed-in user's subscription to one campaign's digest. */
export interface DigestSubscriptionStateDto {
  subscribed: boolean;
  /** True for the campaign lead who never changed the default (subscribed). */
  byDefault: boolean;
  /** null when there is no stored subscription. */
  version: number | null;
}

/** One person who receives a campaign's digest. */
export interface DigestSubscriberDto {
  userId: number;
  name: string;
  email: string;
  role: string;
  byDefault: boolean;
}

/** A campaign as the Digests page lists it. */
export interface DigestCampaignDto {
  campaign: { id: number; name: string; status: CampaignStatus; lead: PersonRefDto | null };
  settings: DigestSettingsDto;
  subscription: DigestSubscriptionStateDto;
  subscriberCount: number;
  lastRun: DigestRunSummaryDto | null;
}

/** GET /api/digests/campaigns. */
export interface DigestCampaignListDto {
  schedule: DigestScheduleDto;
  campaigns: DigestCampaignDto[];
}

/** A value with its standard error. */
export interface ValueWithErrorDto {
  value: number;
  se: number;
}

/** One variant of a digest's ranking. */
export interface DigestRankedVariantDto {
  rank: number;
  variantId: number;
  label: string;
  /** ΔΔG‡ for kcat/Km against the condition-matched parent, kJ/mol (negative = faster than the parent). */
  ddgKjPerMol: ValueWithErrorDto;
  /** Whether |ΔΔG‡| is at least 1.96 standard errors, i.e. the difference from the parent is outside the 95 % interval. */
  clearOfParent: boolean;
  /** kcat/Km of the variant over the parent's. */
  foldChange: ValueWithErrorDto | null;
  /** The variant's kcat/Km, M⁻¹ s⁻¹. */
  kcatOverKmPerMolarSecond: number | null;
  /** Measurements of the variant in the comparison. */
  n: number;
  /** Their review states, counted. */
  reviewStates: Partial<Record<DigestReviewState, number>>;
  substrate: string;
  temperatureC: number;
  ph: number;
  flags: string[];
  notes: string | null;
}

/** A variant that moved in the ranking since the last digest; a null rank means outside the top list. */
export interface DigestMoverDto {
  variantId: number;
  label: string;
  previousRank: number | null;
  rank: number | null;
}

/**
 * Everything a digest says about one campaign, as it was when it was generated: stored with each run, so a
 * past digest can be read again exactly and the next one can tell who moved.
 */
export interface DigestContentDto {
  campaign: {
    id: number;
    name: string;
    objective: string;
    status: CampaignStatus;
    targetSubstrate: string;
    targetPh: number;
    targetTemperatureC: number;
    lead: PersonRefDto | null;
  };
  generatedAt: string;
  /** "This week": the seven days before the digest's time. */
  period: { start: string; end: string };
  timezone: string;
  reviewStates: DigestReviewState[];
  topCount: number;
  parent: { variantId: number; label: string; measurementCount: number } | null;
  ranking: DigestRankedVariantDto[];
  /** Variants with a ΔΔG‡ for kcat/Km (the ranking shows the first `topCount`). */
  rankedCount: number;
  /** Variants measured in the counted states but without a condition-matched parent comparison. */
  unmatchedCount: number;
  movers: {
    /** The digest compared with; null for a campaign's first digest. */
    since: { runId: number; at: string } | null;
    up: DigestMoverDto[];
    down: DigestMoverDto[];
    new: DigestMoverDto[];
  };
  addedVariants: {
    total: number;
    items: { variantId: number; label: string; status: VariantStatus; notes: string | null; createdAt: string }[];
  };
  addedMeasurements: {
    total: number;
    byState: Record<string, number>;
    items: { measurementId: number; variantId: number; label: string; reviewState: string; kcatOverKmPerMolarSecond: number | null; createdAt: string }[];
  };
  awaitingReview: {
    total: number;
    items: { measurementId: number; variantId: number; label: string; since: string }[];
  };
  flags: {
    total: number;
    items: { variantId: number; label: string; codes: string[] }[];
  };
  /** Client path of the registry filtered to this campaign, sorted by ΔΔG‡. */
  registryPath: string;
}

export type DigestRunKind = 'scheduled' | 'manual';
/** `preparing` while the run is being generated (a restart resumes it), `queued` once its messages are in the outbox. */
export type DigestRunStatus = 'preparing' | 'queued';

export interface DigestRunSummaryDto {
  id: number;
  campaignId: number;
  campaignName: string;
  kind: DigestRunKind;
  /** The local date of the scheduled slot, for scheduled runs. */
  weekKey: string | null;
  status: DigestRunStatus;
  scheduledFor: string;
  subject: string | null;
  triggeredBy: PersonRefDto | null;
  recipientCount: number;
  delivery: Record<OutboxStatus, number>;
  createdAt: string;
  completedAt: string | null;
}

/** GET /api/digests/runs/:id: the run with its recipients and the content snapshot, rendered again. */
export interface DigestRunDto extends DigestRunSummaryDto {
  recipients: { email: string; name: string | null; status: OutboxStatus; sentAt: string | null; lastError: string | null; outboxMessageId: number }[];
  content: DigestContentDto | null;
  html: string | null;
  text: string | null;
}

/** GET /api/digests/campaigns/:id/preview: the next digest as the signed-in user would receive it. */
export interface DigestPreviewDto {
  subject: string;
  html: string;
  text: string;
  content: DigestContentDto;
  recipientCount: number;
}

/** GET /api/digests/unsubscribe: what an unsubscribe link is for. */
export interface UnsubscribeLookupDto {
  campaign: { id: number; name: string };
  email: string;
  subscribed: boolean;
}
