import { KineticsInputError } from '../kinetics/kinetics-input-error';

/** A value with its standard error, in any unit shared by all values combined. */
export type ValueWithError = { value: number; se: number };

/** The combined estimate: weighted mean, its standard error, and how many values went in. */
export type CombinedEstimate = { value: number; se: number; n: number };

/**
 * Inverse-variance weighted mean of independent estimates of one quantity (replicate measurements):
 * wᵢ = 1/seᵢ², mean = Σwᵢxᵢ/Σwᵢ, se = 1/√Σwᵢ. This is the minimum-variance unbiased combination when the
 * estimates are independent and their standard errors are right; it does not widen the error when the
 * values scatter more than their errors say (a fixed-effect combination).
 *
 * Standard errors of zero claim exact values, whose weight is unbounded: those values then carry all the
 * weight (the limit wᵢ → ∞), are averaged with equal weights, and the combined standard error is 0. A
 * single value is returned as it is.
 *
 * Reference: Taylor, An Introduction to Error Analysis, 2nd ed. (1997), §7.2 ("the weighted average",
 * eqs. 7.10–7.12); Cochrane Handbook for Systematic Reviews of Interventions, §10.3 (inverse-variance
 * method).
 *
 * @param estimates values with standard errors (same unit), at least one; never modified
 * @throws {KineticsInputError} `combineInverseVariance requires at least one value`, or
 *   `combineInverseVariance requires finite values and finite, non-negative standard errors (estimates[i])`
 * @returns the weighted mean and its standard error (same unit), and n
 * @example
 * // Two equally precise values: the plain mean, with the error shrunk by √2.
 * combineInverseVariance([{ value: 11, se: 1 }, { value: 12, se: 1 }]); // { value: 11.5, se: 0.7071…, n: 2 }
 */
export function combineInverseVariance(estimates: readonly ValueWithError[]): CombinedEstimate {
  if (estimates.length === 0) throw new KineticsInputError('combineInverseVariance requires at least one value');
  let exactCount = 0;
  let exactSum = 0;
  estimates.forEach((estimate, index) => {
    if (!(Number.isFinite(estimate.value) && Number.isFinite(estimate.se) && estimate.se >= 0)) {
      throw new KineticsInputError(
        `combineInverseVariance requires finite values and finite, non-negative standard errors (estimates[${index}])`,
      );
    }
    if (estimate.se === 0) {
      exactCount += 1;
      exactSum += estimate.value;
    }
  });
  if (exactCount > 0) return { value: exactSum / exactCount, se: 0, n: estimates.length };

  // Weights wᵢ = 1/seᵢ², scaled by the smallest seₘ² so that no square under- or overflows:
  // uᵢ = (seₘ/seᵢ)² = wᵢ·seₘ², mean = Σuᵢxᵢ/Σuᵢ, se = 1/√Σwᵢ = seₘ/√Σuᵢ.
  let smallestSe = Number.POSITIVE_INFINITY;
  for (const estimate of estimates) smallestSe = Math.min(smallestSe, estimate.se);
  let weightSum = 0;
  let weightedValueSum = 0;
  for (const estimate of estimates) {
    const ratio = smallestSe / estimate.se;
    const weight = ratio * ratio;
    weightSum += weight;
    weightedValueSum += weight * estimate.value;
  }
  return { value: weightedValueSum / weightSum, se: smallestSe / Math.sqrt(weightSum), n: estimates.length };
}
