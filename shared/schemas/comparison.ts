import { z } from 'zod';
import { countedReviewStates, type CountedReviewState } from './measurement';

/**
 * Query of GET /api/variants/:id/comparison and GET /api/campaigns/:id/cycles: which review states count
 * (a comma-separated subset of draft, submitted, approved; all three by default). The digest, for example,
 * ranks on `submitted,approved` only.
 */
export const comparisonQuery = z.object({
  states: z
    .string({ error: 'must be a comma-separated list of review states' })
    .transform((value, context) => {
      const states = [...new Set(value.split(',').map((state) => state.trim()).filter((state) => state.length > 0))];
      if (states.length === 0 || !states.every((state) => (countedReviewStates as readonly string[]).includes(state))) {
        context.addIssue({ code: 'custom', message: `must list states among ${countedReviewStates.join(', ')}` });
        return z.NEVER;
      }
      return states as CountedReviewState[];
    })
    .optional(),
});
export type ComparisonQuery = z.infer<typeof comparisonQuery>;

/** Replicates combined by inverse-variance weighting, in SI units. */
export interface CombinedValueDto<U extends string> {
  value: number;
  se: number;
  /** How many measurements went in. */
  n: number;
  unit: U;
}

export interface CombinedRatesDto {
  kcat: CombinedValueDto<'s⁻¹'> | null;
  km: CombinedValueDto<'M'> | null;
  kcatOverKm: CombinedValueDto<'M⁻¹ s⁻¹'> | null;
}

/** A free-energy difference with its standard error. */
export interface EnergyDto {
  kJPerMol: { value: number; se: number };
  kcalPerMol: { value: number; se: number };
}

/** The comparison of one condition group of a variant with the condition-matched parent. */
export interface ConditionComparisonDto {
  substrate: string;
  /** Mean assay temperature of the variant's measurements in the group, °C. */
  temperatureC: number;
  ph: number;
  measurementIds: number[];
  parentMeasurementIds: number[];
  variant: CombinedRatesDto;
  parent: CombinedRatesDto | null;
  /** False when no parent measurement matches; `reason` then says why and there are no numbers. */
  matched: boolean;
  reason: string | null;
  /** ΔΔG‡ = −RT ln(k_variant/k_parent) at the assay temperature; positive = slower than the parent. */
  ddgKcatOverKm: EnergyDto | null;
  ddgKcat: EnergyDto | null;
  /** kcat/Km of the variant over the parent's. */
  foldChange: { value: number; se: number } | null;
  log10FoldChange: number | null;
  kcatRatio: { value: number; se: number } | null;
  kmRatio: { value: number; se: number } | null;
  notes: string[];
  onTargetSubstrate: boolean;
  /** √((ΔT/0.5 °C)² + (ΔpH/0.1)²) from the campaign's target conditions. */
  targetDistance: number;
}

/** GET /api/variants/:id/comparison. */
export interface VariantComparisonDto {
  variant: { id: number; label: string; campaignId: number; isParent: boolean };
  parentVariant: { id: number; label: string } | null;
  target: { substrate: string; temperatureC: number; ph: number };
  reviewStates: CountedReviewState[];
  /** Best first; the first is the primary comparison. */
  comparisons: ConditionComparisonDto[];
  primary: ConditionComparisonDto | null;
}

export interface CycleEnergiesDto {
  ddgA: { value: number; se: number };
  ddgB: { value: number; se: number };
  ddgAB: { value: number; se: number };
  predictedAdditive: { value: number; se: number };
  coupling: EnergyDto;
}

/** One double-mutant cycle (energies in kJ/mol unless marked kcal). */
export interface CycleDto {
  combination: { id: number; label: string };
  a: { id: number; label: string };
  b: { id: number; label: string };
  substrate: string;
  temperatureC: number;
  ph: number;
  measurementIds: { combination: number[]; a: number[]; b: number[]; parent: number[] };
  kcatOverKm: CycleEnergiesDto | null;
  kcat: CycleEnergiesDto | null;
}

/** GET /api/campaigns/:id/cycles. */
export interface CampaignCyclesDto {
  campaignId: number;
  reviewStates: CountedReviewState[];
  cycles: CycleDto[];
  unmatched: { combination: { id: number; label: string }; a: { id: number; label: string }; b: { id: number; label: string }; reason: string }[];
}

/** One cell of the landscape: a single-substitution variant. */
export interface LandscapeCellDto {
  position: number;
  from: string;
  to: string;
  variantId: number;
  label: string;
  status: string;
  measurementCount: number;
  /** From the variant's summary (primary comparison); null when not compared with a matched parent. */
  foldChange: number | null;
  log10FoldChange: number | null;
  ddgKjPerMol: number | null;
}

/** GET /api/campaigns/:id/landscape: position × amino acid of single-substitution variants. */
export interface CampaignLandscapeDto {
  campaignId: number;
  /** Column order of the matrix: the twenty amino acids and `*` (stop). */
  aminoAcids: string[];
  positions: { position: number; parentResidue: string; catalyticRoles: string[] }[];
  cells: LandscapeCellDto[];
  counts: { singleVariants: number; measured: number; withFoldChange: number; positions: number; catalyticPositions: number };
}
