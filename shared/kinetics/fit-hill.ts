import { fitCurveLeastSquares } from './curve-least-squares';
import { hillCurve } from './hill-curve';
import { hillInitialEstimate } from './hill-initial-estimate';
import { parameterCovariance } from './parameter-covariance';
import { summarizeFit, type QuantitySpec } from './summarize-fit';
import type { FitResult, RatePoint } from './types';
import { validateCurvePoints } from './validate-curve-points';

const FITTED: readonly QuantitySpec[] = [
  { name: 'vmax', mustBePositive: true, scale: 'ratio' },
  { name: 'khalf', mustBePositive: true, scale: 'ratio' },
  { name: 'hill', mustBePositive: true, scale: 'ratio' },
];

/**
 * Hill fit: v = Vmax·Sⁿ/(K½ⁿ + Sⁿ) by nonlinear least squares, with the machinery and conventions of
 * {@link fitMichaelisMenten} (s² = RSS/(n − 3), t at n − 3 df). The solver keeps K½ > 0 and n > 0 (the
 * model is undefined elsewhere for non-integer n).
 *
 * Reference: Hill, J. Physiol. 40 (1910) iv; Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed.
 * (2012).
 *
 * @param points substrate concentration `s` (≥ 0, any unit) and initial rate `v` (any unit), optional
 *   `weight` (1/σ²); never modified
 * @throws {KineticsInputError} fewer than four distinct substrate concentrations, a non-finite or negative
 *   S, a non-finite v, all v zero, or weights on some points only or not positive
 * @returns a {@link FitResult} with `parameters.vmax` (unit of v), `khalf` (unit of s) and `hill`
 *   (dimensionless)
 * @example
 * const s = [0.5, 1, 2, 4, 8, 16];
 * // Exact data from Vmax = 10, K½ = 2, n = 2:
 * fitHill(s.map((x) => ({ s: x, v: (10 * x * x) / (4 + x * x) }))).parameters.hill.value; // 2
 */
export function fitHill(points: readonly RatePoint[]): FitResult {
  const data = validateCurvePoints('fitHill', 'rate', points, FITTED.length);
  const solution = fitCurveLeastSquares(hillCurve, data, hillInitialEstimate(data.x, data.y));
  const df = points.length - FITTED.length;
  return summarizeFit({
    model: 'hill',
    fitted: FITTED,
    values: solution.parameters,
    covariance: parameterCovariance(solution.normalMatrix, FITTED.length, solution.rss / df),
    solution,
    weightRoot: data.weightRoot,
  });
}
