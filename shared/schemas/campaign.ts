import { z } from 'zod';
import type { VariantStatus } from './variant';

/** Where a campaign stands; a closed campaign takes no new variants. */
export const campaignStatuses = ['active', 'paused', 'closed'] as const;
export type CampaignStatus = (typeof campaignStatuses)[number];

/** Lowest and highest assay temperatures a campaign may target, °C (supercooled buffers to hyperthermophiles). */
export const campaignTemperatureRangeC = { min: -10, max: 120 } as const;

const name = z
  .string({ error: 'is required' })
  .trim()
  .min(1, 'is required')
  .max(200, 'must be at most 200 characters');

const objective = z
  .string({ error: 'is required' })
  .trim()
  .min(1, 'is required (one sentence on what the campaign is to achieve)')
  .max(5000, 'must be at most 5000 characters');

const targetSubstrate = z
  .string({ error: 'is required' })
  .trim()
  .min(1, 'is required')
  .max(200, 'must be at most 200 characters');

const targetPh = z
  .number({ error: 'must be a number' })
  .min(0, 'must be between 0 and 14')
  .max(14, 'must be between 0 and 14');

const targetTemperatureC = z
  .number({ error: 'must be a number' })
  .min(campaignTemperatureRangeC.min, `must be between ${campaignTemperatureRangeC.min} and ${campaignTemperatureRangeC.max} °C`)
  .max(campaignTemperatureRangeC.max, `must be between ${campaignTemperatureRangeC.min} and ${campaignTemperatureRangeC.max} °C`);

const id = (what: string) =>
  z.number({ error: `must be the id of ${what}` }).int('must be a whole number').min(1, 'must be at least 1');

const status = z.enum(campaignStatuses, { error: `must be one of ${campaignStatuses.join(', ')}` });

/**
 * A new campaign on one parent enzyme. `leadId` omitted means the person creating it leads it;
 * `null` leaves the campaign without a lead. The temperature is in °C here and stored in K.
 */
export const createCampaignInput = z.object({
  name,
  objective,
  enzymeId: id('an enzyme'),
  targetSubstrate,
  targetPh,
  targetTemperatureC,
  leadId: id('a user').nullable().optional(),
  status: status.default('active'),
});
export type CreateCampaignInput = z.infer<typeof createCampaignInput>;

/**
 * Changes to a campaign: the `version` read plus at least one field. The enzyme cannot be changed:
 * every variant's positions refer to it.
 */
export const updateCampaignInput = z
  .object({
    version: z.number({ error: 'is required' }).int('must be a whole number').min(1, 'must be at least 1'),
    name: name.optional(),
    objective: objective.optional(),
    targetSubstrate: targetSubstrate.optional(),
    targetPh: targetPh.optional(),
    targetTemperatureC: targetTemperatureC.optional(),
    leadId: id('a user').nullable().optional(),
    status: status.optional(),
  })
  .refine((changes) => Object.entries(changes).some(([field, value]) => field !== 'version' && value !== undefined), {
    message: 'give at least one field to change',
    path: ['name'],
  });
export type UpdateCampaignInput = z.infer<typeof updateCampaignInput>;

/** A person as other resources name them. */
export interface PersonRefDto {
  id: number;
  name: string;
}

/** A campaign as the API returns it, with the count of its variants (the parent included) by status. */
export interface CampaignDto {
  id: number;
  name: string;
  objective: string;
  enzymeId: number;
  enzyme: { id: number; name: string };
  targetSubstrate: string;
  targetPh: number;
  targetTemperatureC: number;
  leadId: number | null;
  lead: PersonRefDto | null;
  status: CampaignStatus;
  /** The campaign's parent variant (the empty mutation set); null only if it was never created. */
  parentVariantId: number | null;
  variantCounts: Record<VariantStatus, number>;
  variantTotal: number;
  version: number;
  createdAt: string;
  updatedAt: string;
}
