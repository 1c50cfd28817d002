import { studentTCritical95 } from './student-t-critical-95';
import type { Estimate } from './types';

/**
 * Estimate of a function g(θ) of fitted parameters, with its standard error by the delta method,
 * se² = ∇gᵀ·C·∇g over the full covariance C (so correlated parameters are not treated as independent),
 * and a Wald 95 % interval g ± t(0.975, df)·se.
 *
 * Reference: Bates & Watts, Nonlinear Regression Analysis and Its Applications (1988), ch. 2; Casella &
 * Berger, Statistical Inference, 2nd ed. (2002), §5.5.4.
 *
 * @param value g(θ̂), in g's unit
 * @param gradient ∂g/∂θⱼ at θ̂, in the order of the covariance rows
 * @param covariance the parameters' covariance, or null when it could not be determined
 * @param degreesOfFreedom residual degrees of freedom n − p (≥ 1)
 * @throws {KineticsInputError} when `degreesOfFreedom` is not a positive integer
 * @returns value, standard error (Infinity when the covariance is null) and 95 % interval
 * @example
 * // se of θ₁ − θ₂ with var 4, 1 and covariance 1: √(4 + 1 − 2) = √3.
 * deltaMethodEstimate(0, [1, -1], [[4, 1], [1, 1]], 10).se; // 1.7320508…
 */
export function deltaMethodEstimate(
  value: number,
  gradient: readonly number[],
  covariance: readonly (readonly number[])[] | null,
  degreesOfFreedom: number,
): Estimate {
  const criticalValue = studentTCritical95(degreesOfFreedom);
  if (covariance === null) {
    return { value, se: Number.POSITIVE_INFINITY, ci95: [Number.NEGATIVE_INFINITY, Number.POSITIVE_INFINITY] };
  }
  let variance = 0;
  for (let i = 0; i < gradient.length; i += 1) {
    // Skipping zero entries keeps an infinite covariance of an unrelated parameter from giving 0·∞ = NaN.
    if (gradient[i] === 0) continue;
    for (let j = 0; j < gradient.length; j += 1) {
      if (gradient[j] !== 0) variance += gradient[i] * gradient[j] * covariance[i][j];
    }
  }
  // Rounding can leave a tiny negative variance when ∇g is almost in the null space of C.
  const se = Math.sqrt(Math.max(variance, 0));
  const halfWidth = criticalValue * se;
  return { value, se, ci95: [value - halfWidth, value + halfWidth] };
}
