import { levenbergMarquardt, type LevenbergMarquardtResult } from './levenberg-marquardt';
import type { CurveFunction } from './types';
import type { CurveData } from './validate-curve-points';

/**
 * Weighted nonlinear least-squares fit of a model curve to data: minimises Σ wᵢ·(yᵢ − f(xᵢ; θ))² by
 * Levenberg–Marquardt with the curve's analytic Jacobian.
 *
 * Reference: Bates & Watts, Nonlinear Regression Analysis and Its Applications (1988), ch. 2.
 *
 * @param curve the model, evaluated at all x at once (see {@link CurveFunction})
 * @param data validated x, y and √weights
 * @param start starting parameters inside the model's domain
 * @throws {RangeError} when `start` is outside the model's domain (a programming error)
 * @returns the solver's result; residuals there are weighted, √wᵢ·(yᵢ − f(xᵢ))
 * @example
 * const data = { x: [1, 2, 4], y: [5, 6.6667, 8], weightRoot: null };
 * fitCurveLeastSquares(michaelisMentenCurve, data, [8, 1]).parameters; // ≈ [10, 1] (v = 10·S/(1 + S) to 4 digits)
 */
export function fitCurveLeastSquares(
  curve: CurveFunction,
  data: CurveData,
  start: readonly number[],
): LevenbergMarquardtResult {
  const { x, y, weightRoot } = data;
  const n = x.length;
  const p = start.length;
  const fitted = new Array<number>(n).fill(0);

  let responseSumOfSquares = 0;
  for (let i = 0; i < n; i += 1) {
    const weighted = weightRoot === null ? y[i] : weightRoot[i] * y[i];
    responseSumOfSquares += weighted * weighted;
  }

  return levenbergMarquardt(
    {
      pointCount: n,
      parameterCount: p,
      responseSumOfSquares,
      evaluate(parameters, residuals, jacobian) {
        curve(x, parameters, fitted, jacobian);
        let rss = 0;
        for (let i = 0; i < n; i += 1) {
          if (weightRoot === null) {
            residuals[i] = y[i] - fitted[i];
          } else {
            residuals[i] = weightRoot[i] * (y[i] - fitted[i]);
            for (let j = 0; j < p; j += 1) jacobian[i * p + j] *= weightRoot[i];
          }
          rss += residuals[i] * residuals[i];
        }
        return rss;
      },
    },
    start,
  );
}
