import { fitCurveLeastSquares } from './curve-least-squares';
import { deltaMethodEstimate } from './delta-method-estimate';
import { parameterCovariance } from './parameter-covariance';
import { phAcidCurve } from './ph-acid-curve';
import { phBaseCurve } from './ph-base-curve';
import { phBellCurve } from './ph-bell-curve';
import { phProfileInitialEstimate } from './ph-profile-initial-estimate';
import { summarizeFit, type QuantitySpec } from './summarize-fit';
import type { CurveFunction, CurveModelName, Estimate, FitResult, PhPoint } from './types';
import { validateCurvePoints } from './validate-curve-points';

const KMAX: QuantitySpec = { name: 'kmax', mustBePositive: true, scale: 'ratio' };
const MODELS: Record<
  'bell' | 'acid' | 'base',
  { name: CurveModelName; curve: CurveFunction; fitted: readonly QuantitySpec[] }
> = {
  bell: {
    name: 'ph-bell',
    curve: phBellCurve,
    fitted: [
      KMAX,
      { name: 'pKa1', mustBePositive: false, scale: 'ph' },
      { name: 'pKa2', mustBePositive: false, scale: 'ph' },
    ],
  },
  acid: { name: 'ph-acid', curve: phAcidCurve, fitted: [KMAX, { name: 'pKa', mustBePositive: false, scale: 'ph' }] },
  base: { name: 'ph-base', curve: phBaseCurve, fitted: [KMAX, { name: 'pKa', mustBePositive: false, scale: 'ph' }] },
};

/** A bell-shaped profile's fit, with the pH optimum and the rate constant there. */
export type PhBellFitResult = FitResult & { phOptimum: Estimate; kAtOptimum: Estimate };

/**
 * pH–rate profile fit by nonlinear least squares (Levenberg–Marquardt, analytic Jacobian), with standard
 * errors from s²(JᵀJ)⁻¹ and Student-t 95 % intervals at n − p degrees of freedom:
 *
 * - `'bell'`: k = kmax/(1 + 10^(pKa1 − pH) + 10^(pH − pKa2)), two ionizations; also the pH optimum
 *   (pKa1 + pKa2)/2 and k there, kmax/(1 + 2·10^(−(pKa2 − pKa1)/2)), with delta-method errors from the
 *   full covariance;
 * - `'acid'`: k = kmax/(1 + 10^(pKa − pH)), one ionization, active when deprotonated;
 * - `'base'`: k = kmax/(1 + 10^(pH − pKa)), one ionization, active when protonated.
 *
 * Residuals are in k on its linear scale, unweighted unless every point carries a weight (1/σ²). Fitting
 * log k instead assumes a constant relative error and gives different estimates; pass weights 1/k² for
 * approximately that behaviour.
 *
 * Reference: Dixon, Biochem. J. 55 (1953) 161; Fersht, Structure and Mechanism in Protein Science (1999);
 * Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012).
 *
 * @param points pH `ph` and rate constant `k` (kcat, kcat/Km or v₀, any unit), optional `weight`; never
 *   modified
 * @param options.model which profile to fit
 * @throws {KineticsInputError} fewer than p + 1 distinct pH values (four for a bell, three for a limb), a
 *   non-finite pH or k, all k zero, or weights on some points only or not positive
 * @returns a {@link FitResult} with `parameters.kmax` (unit of k) and `pKa1`, `pKa2` (bell) or `pKa`
 *   (limb); a bell also has `phOptimum` and `kAtOptimum`
 * @example
 * // Noise-free bell with pKa1 = 4.2, pKa2 = 8.4, kmax = 1 at pH 3.0, 3.5, …, 10.0:
 * const ph = Array.from({ length: 15 }, (_, i) => 3 + i / 2);
 * const points = ph.map((x) => ({ ph: x, k: 1 / (1 + 10 ** (4.2 - x) + 10 ** (x - 8.4)) }));
 * fitPhProfile(points, { model: 'bell' }).kAtOptimum.value; // 0.984361871446…
 */
export function fitPhProfile(points: readonly PhPoint[], options: { model: 'bell' }): PhBellFitResult;
export function fitPhProfile(points: readonly PhPoint[], options: { model: 'acid' | 'base' }): FitResult;
export function fitPhProfile(
  points: readonly PhPoint[],
  options: { model: 'bell' | 'acid' | 'base' },
): FitResult | PhBellFitResult;
export function fitPhProfile(
  points: readonly PhPoint[],
  options: { model: 'bell' | 'acid' | 'base' },
): FitResult | PhBellFitResult {
  const model = MODELS[options.model];
  const p = model.fitted.length;
  const data = validateCurvePoints('fitPhProfile', 'ph', points, p);
  const solution = fitCurveLeastSquares(model.curve, data, phProfileInitialEstimate(data.x, data.y, options.model));
  const df = points.length - p;
  const covariance = parameterCovariance(solution.normalMatrix, p, solution.rss / df);
  const result = summarizeFit({
    model: model.name,
    fitted: model.fitted,
    values: solution.parameters,
    covariance,
    solution,
    weightRoot: data.weightRoot,
  });

  let lowestPh = Number.POSITIVE_INFINITY;
  let highestPh = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < data.x.length; i += 1) {
    lowestPh = Math.min(lowestPh, data.x[i]);
    highestPh = Math.max(highestPh, data.x[i]);
  }
  for (let j = 1; j < p; j += 1) {
    const name = model.fitted[j].name;
    const pKa = solution.parameters[j];
    if (pKa < lowestPh || pKa > highestPh) {
      result.warnings.push(
        `${name} (${pKa.toFixed(2)}) lies outside the pH range tested (${lowestPh}–${highestPh}); ` +
          'it is an extrapolation',
      );
    }
  }
  if (options.model !== 'bell') return result;

  const kmax = solution.parameters[0];
  const pKa1 = solution.parameters[1];
  const pKa2 = solution.parameters[2];
  if (!(pKa1 < pKa2)) {
    result.warnings.push('pKa1 is not below pKa2, so the two ionizations cannot be assigned from these data');
  }
  // At pH = (pKa1 + pKa2)/2 both ionization terms equal g/2 with g = 2·10^(−(pKa2 − pKa1)/2).
  const g = 2 * Math.exp((-Math.LN10 * (pKa2 - pKa1)) / 2);
  const slope = (kmax * g * Math.LN10) / (2 * (1 + g) * (1 + g));
  const bell: PhBellFitResult = Object.assign(result, {
    phOptimum: deltaMethodEstimate((pKa1 + pKa2) / 2, [0, 0.5, 0.5], covariance, df),
    kAtOptimum: deltaMethodEstimate(kmax / (1 + g), [1 / (1 + g), -slope, slope], covariance, df),
  });
  return bell;
}
