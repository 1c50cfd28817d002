import { fitCurveLeastSquares } from './curve-least-squares';
import { parameterCovariance } from './parameter-covariance';
import { substrateInhibitionCurve } from './substrate-inhibition-curve';
import { substrateInhibitionInitialEstimate } from './substrate-inhibition-initial-estimate';
import { summarizeFit, type QuantitySpec } from './summarize-fit';
import type { FitResult, RatePoint } from './types';
import { validateCurvePoints } from './validate-curve-points';

const FITTED: readonly QuantitySpec[] = [
  { name: 'vmax', mustBePositive: true, scale: 'ratio' },
  { name: 'km', mustBePositive: true, scale: 'ratio' },
  { name: 'ki', mustBePositive: true, scale: 'ratio' },
];

/**
 * Substrate-inhibition fit: v = Vmax·S/(Km + S + S²/Ki) (Haldane) by nonlinear least squares, with the
 * machinery and conventions of {@link fitMichaelisMenten} (s² = RSS/(n − 3), t at n − 3 df).
 *
 * The solver works in 1/Ki so that data without inhibition give 1/Ki ≈ 0 instead of sending Ki to
 * infinity; Ki and its standard error are reported through the exact reparametrisation
 * (se(Ki) = se(1/Ki)·Ki²). When the best 1/Ki is not positive the data show no inhibition: Ki is then
 * reported with a warning, and the Michaelis–Menten model (compare with {@link compareModels}) is the one to use.
 *
 * Reference: Haldane, Enzymes (1930); Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012).
 *
 * @param points substrate concentration `s` (≥ 0, any unit) and initial rate `v` (any unit), optional
 *   `weight` (1/σ²); never modified
 * @throws {KineticsInputError} fewer than four distinct substrate concentrations, a non-finite or negative
 *   S, a non-finite v, all v zero, or weights on some points only or not positive
 * @returns a {@link FitResult} with `parameters.vmax` (unit of v), `km` and `ki` (unit of s)
 * @example
 * const s = [0.25, 0.5, 1, 2, 4, 8, 16, 32];
 * // Exact data from Vmax = 10, Km = 1, Ki = 8:
 * fitSubstrateInhibition(s.map((x) => ({ s: x, v: (10 * x) / (1 + x + (x * x) / 8) }))).parameters.ki.value; // 8
 */
export function fitSubstrateInhibition(points: readonly RatePoint[]): FitResult {
  const data = validateCurvePoints('fitSubstrateInhibition', 'rate', points, FITTED.length);
  const solution = fitCurveLeastSquares(
    substrateInhibitionCurve,
    data,
    substrateInhibitionInitialEstimate(data.x, data.y),
  );
  const [vmax, km, inverseKi] = solution.parameters;
  const df = points.length - FITTED.length;
  const covariance = parameterCovariance(solution.normalMatrix, FITTED.length, solution.rss / df);

  // Ki = 1/u; u = 0 exactly (no inhibition at all) has no finite Ki, and the largest finite number stands
  // in for it beside the warning below.
  const ki = inverseKi === 0 ? Number.MAX_VALUE : 1 / inverseKi;
  if (covariance !== null) mapCovarianceToKi(covariance, ki);

  const result = summarizeFit({
    model: 'substrate-inhibition',
    fitted: FITTED,
    values: [vmax, km, ki],
    covariance,
    solution,
    weightRoot: data.weightRoot,
  });
  if (!(inverseKi > 0)) {
    result.warnings.push(
      'the data show no substrate inhibition (1/Ki is not positive), so Ki is not determined; ' +
        'use the Michaelis–Menten model',
    );
  }
  return result;
}

/**
 * Maps the covariance from u = 1/Ki to Ki in place: row and column 2 scale by dKi/du = −Ki². When Ki² overflows,
 * Ki's variance is infinite and so are its covariances (deltaMethodEstimate skips zero gradient entries, so the
 * other parameters' errors stay finite).
 */
function mapCovarianceToKi(covariance: number[][], ki: number): void {
  const derivative = -(ki * ki);
  for (let j = 0; j < 2; j += 1) {
    const value = Number.isFinite(derivative) ? covariance[2][j] * derivative : Number.POSITIVE_INFINITY;
    covariance[2][j] = value;
    covariance[j][2] = value;
  }
  covariance[2][2] *= derivative * derivative;
}
