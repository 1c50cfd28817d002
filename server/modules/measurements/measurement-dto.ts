import { siUnits, type UnitValue } from '@shared/schemas/assay';
import { countedReviewStates, type MeasurementDto } from '@shared/schemas/measurement';
import { plausibilityFlags, type PlausibilityInput } from '@shared/kinetics/plausibility';
import { REPLICATES_ITEM, strendaCompleteness, type StrendaCompleteness } from '@shared/reporting/strenda-completeness';
import type { Assay } from '../assays/assay.entity';
import { toAssayConditionsDto, type VariantContext } from '../assays/assay-conditions';
import type { Measurement, StoredFlag } from './measurement.entity';

/** Audit entity type of measurements. */
export const measurementAuditType = 'measurement';

/** The variant fields a measurement DTO names. */
export interface VariantRef {
  id: number;
  label: string;
  campaignId: number;
}

/**
 * A stored measurement as the API returns it: values in SI-coherent units with their unit labels,
 * standard errors and 95 % intervals (null where unknown or unbounded, e.g. a singular fit).
 *
 * @param measurement the row
 * @param assay its assay (for the conditions)
 * @param variant its variant
 * @returns the DTO
 */
export function toMeasurementDto(measurement: Measurement, assay: Assay, variant: VariantRef): MeasurementDto {
  const ci = measurement.ci95;
  return {
    id: measurement.id,
    assayId: measurement.assayId,
    variant: { id: variant.id, label: variant.label, campaignId: variant.campaignId },
    source: measurement.source,
    model: measurement.model,
    kcat: unitValue(measurement.kcat, measurement.kcatSe, ci.kcat, siUnits.turnover),
    km: unitValue(measurement.km, measurement.kmSe, ci.km, siUnits.concentration),
    kcatOverKm: unitValue(measurement.kcatOverKm, measurement.kcatOverKmSe, ci.kcatOverKm, siUnits.specificity),
    vmax: unitValue(measurement.vmax, measurement.vmaxSe, ci.vmax, siUnits.rate),
    ki: unitValue(measurement.ki, measurement.kiSe, ci.ki, siUnits.concentration),
    hill: unitValue(measurement.hillN, measurement.hillNSe, ci.hill, ''),
    residualSd: measurement.residualSd === null ? null : { value: measurement.residualSd, unit: siUnits.rate },
    degreesOfFreedom: measurement.degreesOfFreedom,
    pointCount: measurement.pointCount,
    substrateRange:
      measurement.substrateMinMolar === null || measurement.substrateMaxMolar === null
        ? null
        : { min: measurement.substrateMinMolar, max: measurement.substrateMaxMolar, unit: siUnits.concentration },
    // An entered measurement without a replicate count has an assay row saying 1; the DTO says unknown.
    replicateCount: measurement.completenessMissing.includes(REPLICATES_ITEM) ? null : assay.replicateCount,
    fittingMethod: measurement.fittingMethod,
    warnings: measurement.warnings,
    flags: measurement.flags,
    completeness: { score: measurement.completenessScore, missing: measurement.completenessMissing },
    conditions: toAssayConditionsDto(assay),
    reviewState: measurement.reviewState,
    reviewReason: measurement.reviewReason,
    reviewedById: measurement.reviewedById,
    reviewedAt: measurement.reviewedAt ? measurement.reviewedAt.toISOString() : null,
    supersededById: measurement.supersededById,
    counts: counts(measurement),
    createdById: measurement.createdById,
    createdAt: measurement.createdAt.toISOString(),
    updatedAt: measurement.updatedAt.toISOString(),
    version: measurement.version,
  };
}

/**
 * Whether a measurement enters comparisons and summaries: a counted review state and not superseded.
 *
 * @param measurement the row
 * @returns true when it counts
 */
export function counts(measurement: Pick<Measurement, 'reviewState' | 'supersededById'>): boolean {
  return measurement.supersededById === null && (countedReviewStates as readonly string[]).includes(measurement.reviewState);
}

function unitValue<U extends string>(
  value: number | null,
  se: number | null,
  ci95: [number, number] | null | undefined,
  unit: U,
): UnitValue<U> | null {
  if (value === null) return null;
  return {
    value,
    se: se !== null && Number.isFinite(se) ? se : null,
    ci95: ci95 && Number.isFinite(ci95[0]) && Number.isFinite(ci95[1]) ? ci95 : null,
    unit,
  };
}

/**
 * The fields of a measurement an audit event records (the numbers and the review state).
 *
 * @param measurement the row
 * @returns a JSON-safe snapshot
 */
export function measurementSnapshot(measurement: Measurement): Record<string, unknown> {
  return {
    id: measurement.id,
    assayId: measurement.assayId,
    variantId: measurement.variantId,
    source: measurement.source,
    model: measurement.model,
    kcat: measurement.kcat,
    kcatSe: measurement.kcatSe,
    km: measurement.km,
    kmSe: measurement.kmSe,
    kcatOverKm: measurement.kcatOverKm,
    kcatOverKmSe: measurement.kcatOverKmSe,
    reviewState: measurement.reviewState,
    reviewReason: measurement.reviewReason,
    supersededById: measurement.supersededById,
    version: measurement.version,
  };
}

/**
 * Plausibility flags in the stored form. Only finite positive values are passed on (a non-positive fitted
 * value has been refused before, and an infinite standard error carries its own fit warning).
 *
 * @param input kcat (s⁻¹), Km (M), kcat/Km (M⁻¹ s⁻¹) and the substrate concentrations tested (M)
 * @returns the flags
 */
export function storedFlags(input: {
  kcat: { value: number; se: number } | null;
  km: { value: number; se: number } | null;
  kcatOverKm: { value: number; se: number } | null;
  substrateMolar: readonly number[] | null;
}): StoredFlag[] {
  const measured = (estimate: { value: number; se: number } | null) =>
    estimate && Number.isFinite(estimate.value) && estimate.value > 0
      ? { value: estimate.value, se: Number.isFinite(estimate.se) ? estimate.se : undefined }
      : undefined;
  const plausibility: PlausibilityInput = {
    kcatPerSecond: measured(input.kcat),
    kmMolar: measured(input.km),
    kcatOverKmPerMolarSecond: measured(input.kcatOverKm),
    substrateMolar: input.substrateMolar && input.substrateMolar.some((s) => s > 0) ? input.substrateMolar : undefined,
  };
  return plausibilityFlags(plausibility).map((flag) => ({ code: flag.code, severity: flag.severity, message: flag.message }));
}

/**
 * STRENDA completeness of a measurement from its enzyme, assay conditions and results.
 *
 * @param context the variant's campaign and enzyme
 * @param assay the assay's condition columns (SI)
 * @param results the measurement's parameters (SI), replicates, model and fitting method
 * @returns score, present and missing items
 */
export function completenessFor(
  context: VariantContext,
  assay: Pick<Assay, 'temperatureK' | 'ph' | 'bufferName' | 'bufferMolar' | 'metalSalt' | 'metalMolar' | 'enzymeMolar'>,
  results: {
    kcat: { value: number; se: number } | null;
    km: { value: number; se: number } | null;
    substrateMinMolar: number | null;
    substrateMaxMolar: number | null;
    replicateCount: number | null;
    model: string;
    fittingMethod: string | null;
  },
): StrendaCompleteness {
  const finiteSe = (estimate: { value: number; se: number } | null) =>
    estimate === null ? null : { value: estimate.value, se: Number.isFinite(estimate.se) ? estimate.se : null };
  return strendaCompleteness({
    enzymeName: context.enzyme.name,
    ecNumber: context.enzyme.ecNumber,
    organism: context.enzyme.organism,
    sequence: context.enzyme.sequence,
    accession: context.enzyme.accession,
    temperatureKelvin: assay.temperatureK,
    ph: assay.ph,
    bufferName: assay.bufferName,
    bufferMolar: assay.bufferMolar,
    metalCofactorRequired: context.metalCofactorRequired,
    metalSalt: assay.metalSalt,
    metalMolar: assay.metalMolar,
    substrateMinMolar: results.substrateMinMolar,
    substrateMaxMolar: results.substrateMaxMolar,
    enzymeMolar: assay.enzymeMolar,
    kcat: finiteSe(results.kcat),
    km: finiteSe(results.km),
    replicateCount: results.replicateCount,
    model: results.model,
    fittingMethod: results.fittingMethod,
  });
}
