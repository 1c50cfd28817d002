import { deltaDeltaGActivation } from '../kinetics/delta-delta-g';
import type { FreeEnergyDifference } from '../kinetics/types';
import { ZERO_CELSIUS_KELVIN } from '../kinetics/units';
import { combineInverseVariance, type CombinedEstimate, type ValueWithError } from './combine-inverse-variance';
import {
  conditionsMatch,
  MATCH_PH_TOLERANCE,
  MATCH_TEMPERATURE_TOLERANCE_KELVIN,
  substrateKey,
  type AssayConditions,
} from './conditions-match';
import { groupByConditions } from './group-by-conditions';

/** One measurement as the comparison sees it: its conditions and rate constants in SI-coherent units. */
export type ComparableMeasurement = AssayConditions & {
  id: number;
  /** kcat, s⁻¹, with its standard error; null when not measured. */
  kcatPerSecond: ValueWithError | null;
  /** Km (or K½), M. */
  kmMolar: ValueWithError | null;
  /** kcat/Km, M⁻¹ s⁻¹. */
  kcatOverKmPerMolarSecond: ValueWithError | null;
};

/** The campaign's target conditions, which decide the primary comparison. */
export type TargetConditions = AssayConditions;

/** Replicates of one condition group combined by inverse-variance weighting (units as in the input). */
export type CombinedRates = {
  kcatPerSecond: CombinedEstimate | null;
  kmMolar: CombinedEstimate | null;
  kcatOverKmPerMolarSecond: CombinedEstimate | null;
};

/** A dimensionless ratio variant/parent with its standard error (relative errors propagated). */
export type RatioEstimate = { value: number; se: number };

/** The comparison of one condition group of the variant with the condition-matched parent. */
export type ConditionComparison = {
  /** Substrate as written in the group's first measurement. */
  substrate: string;
  /** Mean assay temperature of the variant's measurements in the group, K; ΔΔG‡ is computed at it. */
  temperatureKelvin: number;
  /** Mean assay pH of the variant's measurements in the group. */
  ph: number;
  measurementIds: number[];
  variant: CombinedRates;
  /** Parent measurements that match every measurement of the group. */
  parentMeasurementIds: number[];
  parent: CombinedRates | null;
  /** Why there is no comparison (no matched parent); null when there is one. */
  reason: string | null;
  /** ΔΔG‡ for kcat/Km, −RT ln(variant/parent); positive when the variant is slower. */
  ddgKcatOverKm: FreeEnergyDifference | null;
  /** ΔΔG‡ for kcat. */
  ddgKcat: FreeEnergyDifference | null;
  /** kcat/Km of the variant over that of the parent. */
  foldChangeKcatOverKm: RatioEstimate | null;
  /** kcat of the variant over that of the parent. */
  kcatRatio: RatioEstimate | null;
  /** Km of the variant over that of the parent. */
  kmRatio: RatioEstimate | null;
  /** Why a particular number is missing although the conditions matched, and values left out. */
  notes: string[];
  /** Whether the group's substrate is the campaign's target substrate. */
  onTargetSubstrate: boolean;
  /**
   * Distance from the target conditions in units of the matching tolerances,
   * √((ΔT/0.5 K)² + (ΔpH/0.1)²): 1 means one tolerance away.
   */
  targetDistance: number;
};

/** Every condition group's comparison, best first, and the primary (first) one. */
export type ParentComparison = {
  comparisons: ConditionComparison[];
  primary: ConditionComparison | null;
};

type RateName = keyof CombinedRates;

const RATE_LABELS: Record<RateName, string> = {
  kcatPerSecond: 'kcat',
  kmMolar: 'Km',
  kcatOverKmPerMolarSecond: 'kcat/Km',
};

const RATE_NAMES: readonly RateName[] = ['kcatPerSecond', 'kmMolar', 'kcatOverKmPerMolarSecond'];

/**
 * Compares a variant with its parent under matched assay conditions.
 *
 * 1. The variant's measurements are grouped so that all measurements of a group match one another
 *    ({@link groupByConditions}); replicates within a group are combined by inverse-variance weighting
 *    ({@link combineInverseVariance}), separately for kcat, Km and kcat/Km.
 * 2. The parent measurements that match every measurement of the group are combined the same way.
 * 3. ΔΔG‡ = −RT ln(k_variant/k_parent) for kcat/Km and for kcat at the group's mean assay temperature
 *    ({@link deltaDeltaGActivation}), the fold change in kcat/Km, the kcat ratio and the Km ratio, each with
 *    relative standard errors propagated as independent.
 * 4. Groups are ordered best first: the campaign's target substrate first, then groups that yield ΔΔG‡ for
 *    kcat/Km, then those with any matched parent, then nearest to the target temperature and pH (distance
 *    in units of the tolerances), then more measurements. The first is the primary comparison.
 *
 * Without a matched parent a group gets a `reason` and no numbers. A value without a finite standard
 * error, or not positive, cannot be weighted or put into a logarithm: it is left out with a note.
 *
 * With `variantIsParent` the variant is the parent itself: each group is its own reference, so ratios are
 * 1 and ΔΔG‡ is 0 with no error (the same data on both sides of the ratio cancel exactly).
 *
 * Reference: Fersht, Structure and Mechanism in Protein Science (1999), ch. 15 (ΔΔG‡ from rate ratios of
 * mutants measured under identical conditions); Taylor, An Introduction to Error Analysis, 2nd ed.
 * (1997), §3.8 and §7.2 (propagation of relative errors; weighted averages).
 *
 * @param variantMeasurements the variant's measurements (temperatures in K, rates in SI-coherent units)
 * @param parentMeasurements the parent variant's measurements
 * @param target the campaign's target substrate, temperature (K) and pH
 * @param options.variantIsParent true when the variant is the parent itself
 * @throws {KineticsInputError} only for a non-finite, non-positive temperature (the rate values are screened)
 * @returns every group's comparison, best first, and the primary one (null without measurements)
 * @example
 * const at37 = { substrate: 'pNPA', temperatureKelvin: 310.15, ph: 6 };
 * const parent = [{ ...at37, id: 1, kcatPerSecond: { value: 10, se: 0.5 }, kmMolar: { value: 1e-3, se: 1e-4 }, kcatOverKmPerMolarSecond: { value: 1e4, se: 500 } }];
 * const variant = [{ ...at37, id: 2, kcatPerSecond: { value: 1, se: 0.05 }, kmMolar: { value: 1e-3, se: 1e-4 }, kcatOverKmPerMolarSecond: { value: 1e3, se: 50 } }];
 * compareWithParent(variant, parent, at37).primary?.ddgKcatOverKm?.kJPerMol.value; // 5.93775 (= RT ln 10 at 310.15 K)
 */
export function compareWithParent(
  variantMeasurements: readonly ComparableMeasurement[],
  parentMeasurements: readonly ComparableMeasurement[],
  target: TargetConditions,
  options: { variantIsParent?: boolean } = {},
): ParentComparison {
  const targetKey = substrateKey(target.substrate);
  const comparisons = groupByConditions(variantMeasurements).map((group) => {
    const notes: string[] = [];
    const temperatureKelvin = mean(group.map((measurement) => measurement.temperatureKelvin));
    const ph = mean(group.map((measurement) => measurement.ph));
    const variant = combineRates(group, 'variant', notes);
    const matchedParent = options.variantIsParent
      ? group
      : parentMeasurements.filter((candidate) => group.every((member) => conditionsMatch(member, candidate)));
    const parent = options.variantIsParent
      ? variant
      : matchedParent.length > 0
        ? combineRates(matchedParent, 'parent', notes)
        : null;
    const comparison: ConditionComparison = {
      substrate: group[0].substrate,
      temperatureKelvin,
      ph,
      measurementIds: group.map((measurement) => measurement.id),
      variant,
      parentMeasurementIds: matchedParent.map((measurement) => measurement.id),
      parent,
      reason: parent === null ? noParentReason(group, parentMeasurements.length) : null,
      ddgKcatOverKm: null,
      ddgKcat: null,
      foldChangeKcatOverKm: null,
      kcatRatio: null,
      kmRatio: null,
      notes,
      onTargetSubstrate: substrateKey(group[0].substrate) === targetKey,
      targetDistance: Math.hypot(
        (temperatureKelvin - target.temperatureKelvin) / MATCH_TEMPERATURE_TOLERANCE_KELVIN,
        (ph - target.ph) / MATCH_PH_TOLERANCE,
      ),
    };
    if (parent === null) return comparison;

    const ratios = options.variantIsParent ? identityRatio : ratio;
    comparison.foldChangeKcatOverKm = ratios(variant.kcatOverKmPerMolarSecond, parent.kcatOverKmPerMolarSecond);
    comparison.kcatRatio = ratios(variant.kcatPerSecond, parent.kcatPerSecond);
    comparison.kmRatio = ratios(variant.kmMolar, parent.kmMolar);
    comparison.ddgKcatOverKm = options.variantIsParent
      ? identityEnergy(variant.kcatOverKmPerMolarSecond)
      : energy(variant.kcatOverKmPerMolarSecond, parent.kcatOverKmPerMolarSecond, temperatureKelvin);
    comparison.ddgKcat = options.variantIsParent
      ? identityEnergy(variant.kcatPerSecond)
      : energy(variant.kcatPerSecond, parent.kcatPerSecond, temperatureKelvin);
    for (const name of ['kcatOverKmPerMolarSecond', 'kcatPerSecond'] as const) {
      if (variant[name] === null || parent[name] === null) {
        const side = variant[name] === null ? 'the variant' : 'the matched parent';
        notes.push(`no ΔΔG‡ for ${RATE_LABELS[name]}: ${side} has no usable ${RATE_LABELS[name]} under these conditions`);
      }
    }
    return comparison;
  });

  comparisons.sort(
    (first, second) =>
      Number(second.onTargetSubstrate) - Number(first.onTargetSubstrate) ||
      comparability(second) - comparability(first) ||
      first.targetDistance - second.targetDistance ||
      second.measurementIds.length - first.measurementIds.length ||
      Math.min(...first.measurementIds) - Math.min(...second.measurementIds),
  );
  return { comparisons, primary: comparisons[0] ?? null };
}

/** 2 for a kcat/Km comparison, 1 for a matched parent without one, 0 for no matched parent. */
function comparability(comparison: ConditionComparison): number {
  if (comparison.ddgKcatOverKm !== null) return 2;
  return comparison.parent !== null ? 1 : 0;
}

function combineRates(
  measurements: readonly ComparableMeasurement[],
  side: 'variant' | 'parent',
  notes: string[],
): CombinedRates {
  const combined: CombinedRates = { kcatPerSecond: null, kmMolar: null, kcatOverKmPerMolarSecond: null };
  for (const name of RATE_NAMES) {
    const usable: ValueWithError[] = [];
    for (const measurement of measurements) {
      const rate = measurement[name];
      if (rate === null) continue;
      if (Number.isFinite(rate.value) && rate.value > 0 && Number.isFinite(rate.se) && rate.se >= 0) {
        usable.push(rate);
      } else {
        notes.push(
          `${RATE_LABELS[name]} of ${side} measurement ${measurement.id} is left out: it needs a positive value and a finite standard error`,
        );
      }
    }
    combined[name] = usable.length > 0 ? combineInverseVariance(usable) : null;
  }
  return combined;
}

function ratio(variant: CombinedEstimate | null, parent: CombinedEstimate | null): RatioEstimate | null {
  if (variant === null || parent === null) return null;
  const value = variant.value / parent.value;
  return { value, se: value * Math.hypot(variant.se / variant.value, parent.se / parent.value) };
}

function identityRatio(variant: CombinedEstimate | null): RatioEstimate | null {
  return variant === null ? null : { value: 1, se: 0 };
}

function energy(
  variant: CombinedEstimate | null,
  parent: CombinedEstimate | null,
  temperatureKelvin: number,
): FreeEnergyDifference | null {
  if (variant === null || parent === null) return null;
  return deltaDeltaGActivation(variant, parent, temperatureKelvin);
}

function identityEnergy(variant: CombinedEstimate | null): FreeEnergyDifference | null {
  return variant === null ? null : { kJPerMol: { value: 0, se: 0 }, kcalPerMol: { value: 0, se: 0 } };
}

function mean(values: readonly number[]): number {
  let sum = 0;
  for (const value of values) sum += value;
  return sum / values.length;
}

/** The sentence a page shows instead of a number. */
function noParentReason(group: readonly ComparableMeasurement[], parentCount: number): string {
  if (parentCount === 0) return 'the parent has no measurements to compare with';
  const temperaturesCelsius = group.map((measurement) => measurement.temperatureKelvin - ZERO_CELSIUS_KELVIN);
  const phs = group.map((measurement) => measurement.ph);
  const conditions =
    group.length === 1
      ? `${formatNumber(temperaturesCelsius[0])} °C, pH ${formatNumber(phs[0])}`
      : `each of the ${group.length} variant measurements (${range(temperaturesCelsius)} °C, pH ${range(phs)})`;
  return `no parent measurement with substrate ${group[0].substrate.trim()} within ${MATCH_TEMPERATURE_TOLERANCE_KELVIN} °C and ${MATCH_PH_TOLERANCE} pH of ${conditions}`;
}

function range(values: readonly number[]): string {
  const lowest = Math.min(...values);
  const highest = Math.max(...values);
  return lowest === highest ? formatNumber(lowest) : `${formatNumber(lowest)}–${formatNumber(highest)}`;
}

/** At least one and at most two decimals: 37 → "37.0", 6.05 → "6.05". */
function formatNumber(value: number): string {
  const hundredths = Math.round(value * 100);
  return hundredths % 10 === 0 ? (hundredths / 100).toFixed(1) : (hundredths / 100).toFixed(2);
}
