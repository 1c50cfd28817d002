import { z } from 'zod';
import type { AssayConditionsDto, KineticModelName, UnitValue } from './assay';

/** Review states of a measurement, in the order a measurement usually passes through them. */
export const reviewStateNames = ['draft', 'submitted', 'approved', 'flagged', 'retracted'] as const;
export type ReviewStateName = (typeof reviewStateNames)[number];

/**
 * The measurements that count in comparisons, summaries, cycles and the landscape: drafts, submitted and
 * approved ones that have not been superseded by a refit. Flagged and retracted measurements are kept and
 * shown but left out of every number derived from several measurements.
 */
export const countedReviewStates = ['draft', 'submitted', 'approved'] as const satisfies readonly ReviewStateName[];
export type CountedReviewState = (typeof countedReviewStates)[number];

export const reviewActions = ['submit', 'approve', 'flag', 'retract'] as const;
export type ReviewAction = (typeof reviewActions)[number];

/** Actions that need a reason, which is stored with the measurement and in the audit log. */
export const reviewActionsNeedingReason: readonly ReviewAction[] = ['flag', 'retract'];

/**
 * The review state machine: from which states each action may be taken and where it leads. Submitting is the
 * kineticist's step; approving and flagging are the lead's; retracting (final) is open to both. A lead may
 * clear a flag by approving, and may flag an approved measurement when a problem turns up later.
 */
export const reviewTransitions: Record<ReviewAction, { from: readonly ReviewStateName[]; to: ReviewStateName }> = {
  submit: { from: ['draft'], to: 'submitted' },
  approve: { from: ['submitted', 'flagged'], to: 'approved' },
  flag: { from: ['submitted', 'approved'], to: 'flagged' },
  retract: { from: ['draft', 'submitted', 'approved', 'flagged'], to: 'retracted' },
};

const version = z.number({ error: 'is required' }).int('must be a whole number').min(1, 'must be at least 1');
const id = z.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1');
const action = z.enum(reviewActions, { error: `must be one of ${reviewActions.join(', ')}` });
const reason = z
  .string({ error: 'must be text' })
  .trim()
  .max(1000, 'must be at most 1000 characters')
  .nullable()
  .optional()
  .transform((value) => (value ? value : null));

function requireReason(review: { action: ReviewAction; reason: string | null }, context: z.RefinementCtx): void {
  if (reviewActionsNeedingReason.includes(review.action) && !review.reason) {
    context.addIssue({ code: 'custom', path: ['reason'], message: `is required to ${review.action} a measurement` });
  }
}

/** Body of POST /api/measurements/:id/review. */
export const reviewMeasurementInput = z.object({ version, action, reason }).superRefine(requireReason);
export type ReviewMeasurementInput = z.infer<typeof reviewMeasurementInput>;

/** Most measurements one bulk review may change. */
export const maxBulkReviewItems = 500;

/** Body of POST /api/measurements/review: all items change or none. */
export const bulkReviewInput = z
  .object({
    items: z
      .array(z.object({ id, version }), { error: 'must be a list of { id, version }' })
      .min(1, 'must contain at least one measurement')
      .max(maxBulkReviewItems, `must have at most ${maxBulkReviewItems} measurements`),
    action,
    reason,
  })
  .superRefine((review, context) => {
    requireReason(review, context);
    const seen = new Set<number>();
    review.items.forEach((item, index) => {
      if (seen.has(item.id)) {
        context.addIssue({ code: 'custom', path: ['items', index, 'id'], message: `lists measurement ${item.id} twice` });
      }
      seen.add(item.id);
    });
  });
export type BulkReviewInput = z.infer<typeof bulkReviewInput>;

const queryId = z.coerce.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1');

/** A comma-separated list of review states in a query string (`reviewState=submitted,flagged`). */
export const reviewStateList = z
  .string({ error: 'must be a comma-separated list of review states' })
  .transform((value, context) => {
    const states = value
      .split(',')
      .map((state) => state.trim())
      .filter((state) => state.length > 0);
    const unknown = states.filter((state) => !(reviewStateNames as readonly string[]).includes(state));
    if (unknown.length > 0 || states.length === 0) {
      context.addIssue({ code: 'custom', message: `must list review states among ${reviewStateNames.join(', ')}` });
      return z.NEVER;
    }
    return [...new Set(states)] as ReviewStateName[];
  });

/** Query of GET /api/measurements (the Review page). */
export const measurementListQuery = z.object({
  campaignId: queryId.optional(),
  variantId: queryId.optional(),
  reviewState: reviewStateList.optional(),
  page: queryId.default(1),
  pageSize: queryId.max(500, 'must be at most 500').default(50),
});
export type MeasurementListQuery = z.infer<typeof measurementListQuery>;

/** A stored plausibility or reporting concern. */
export interface MeasurementFlagDto {
  code: string;
  severity: 'implausible' | 'warning';
  message: string;
}

/** A measurement as the API returns it; every quantity in SI-coherent units with its unit label. */
export interface MeasurementDto {
  id: number;
  assayId: number;
  variant: { id: number; label: string; campaignId: number };
  source: 'fitted' | 'entered';
  model: KineticModelName;
  kcat: UnitValue<'s⁻¹'> | null;
  /** Km, or K½ for the Hill model. */
  km: UnitValue<'M'> | null;
  kcatOverKm: UnitValue<'M⁻¹ s⁻¹'> | null;
  vmax: UnitValue<'M s⁻¹'> | null;
  ki: UnitValue<'M'> | null;
  hill: UnitValue<''> | null;
  residualSd: { value: number; unit: 'M s⁻¹' } | null;
  degreesOfFreedom: number | null;
  pointCount: number | null;
  substrateRange: { min: number; max: number; unit: 'M' } | null;
  /** Null when not reported. */
  replicateCount: number | null;
  fittingMethod: string | null;
  warnings: string[];
  flags: MeasurementFlagDto[];
  completeness: { score: number; missing: string[] };
  conditions: AssayConditionsDto;
  reviewState: ReviewStateName;
  reviewReason: string | null;
  reviewedById: number | null;
  reviewedAt: string | null;
  supersededById: number | null;
  /** Whether it enters comparisons (counted state and not superseded). */
  counts: boolean;
  createdById: number | null;
  createdAt: string;
  updatedAt: string;
  version: number;
}
