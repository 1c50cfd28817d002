import { fitCurveLeastSquares } from './curve-least-squares';
import { KineticsInputError } from './kinetics-input-error';
import { michaelisMentenCurve } from './michaelis-menten-curve';
import { michaelisMentenInitialEstimate } from './michaelis-menten-initial-estimate';
import { parameterCovariance } from './parameter-covariance';
import { summarizeFit, type DerivedQuantity, type QuantitySpec } from './summarize-fit';
import type { FitResult, RatePoint } from './types';
import { validateCurvePoints } from './validate-curve-points';

const FITTED: readonly QuantitySpec[] = [
  { name: 'vmax', mustBePositive: true, scale: 'ratio' },
  { name: 'km', mustBePositive: true, scale: 'ratio' },
];
const KCAT: QuantitySpec = { name: 'kcat', mustBePositive: true, scale: 'ratio' };
const KCAT_OVER_KM: QuantitySpec = { name: 'kcatOverKm', mustBePositive: true, scale: 'ratio' };

/** Options of {@link fitMichaelisMenten}. */
export type MichaelisMentenOptions = {
  /** Total enzyme concentration [E]ₜ, in the concentration unit of v's numerator (e.g. M when v is M/s). */
  enzymeConcentration?: number;
};

/**
 * Michaelis–Menten fit: v = Vmax·S/(Km + S) by nonlinear least squares (Levenberg–Marquardt, analytic
 * Jacobian), starting from a Hanes–Woolf estimate, with standard errors from s²(JᵀJ)⁻¹, s² = RSS/(n − 2),
 * and 95 % intervals from Student's t at n − 2 degrees of freedom. Residuals are in v, unweighted unless
 * every point carries a weight (1/σ²).
 *
 * With `enzymeConcentration`, also kcat = Vmax/[E]ₜ and kcat/Km = Vmax/([E]ₜ·Km); the standard error of
 * kcat/Km uses the full covariance of Vmax and Km (delta method), because the two are strongly correlated
 * and treating them as independent overstates its error.
 *
 * Reference: Michaelis & Menten, Biochem. Z. 49 (1913) 333; Bates & Watts, Nonlinear Regression Analysis
 * and Its Applications (1988), ch. 2 and appendix 1 (the Puromycin data).
 *
 * @param points substrate concentration `s` (≥ 0, any unit) and initial rate `v` (any unit), optional
 *   `weight`; never modified
 * @param options.enzymeConcentration total enzyme concentration (> 0) for kcat and kcat/Km
 * @throws {KineticsInputError} fewer than three distinct substrate concentrations, a non-finite or
 *   negative S, a non-finite v, all v zero, weights on some points only or not positive, or an enzyme
 *   concentration that is not a finite positive number
 * @returns a {@link FitResult} with `parameters.vmax` (unit of v) and `parameters.km` (unit of s), and with
 *   an enzyme concentration `kcat` (v's unit / [E]'s unit) and `kcatOverKm` (kcat's unit / s's unit)
 * @example
 * // Puromycin, treated cells (Bates & Watts 1988): Vmax = 212.68 ± 6.947, Km = 0.06412 ± 0.008281.
 * const s = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1];
 * const v = [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200];
 * fitMichaelisMenten(s.map((si, i) => ({ s: si, v: v[i] }))).parameters.vmax.value; // 212.6837…
 */
export function fitMichaelisMenten(
  points: readonly RatePoint[],
  options: MichaelisMentenOptions = {},
): FitResult {
  const { enzymeConcentration } = options;
  if (enzymeConcentration !== undefined && !(Number.isFinite(enzymeConcentration) && enzymeConcentration > 0)) {
    throw new KineticsInputError('fitMichaelisMenten requires a finite, positive enzyme concentration');
  }
  const data = validateCurvePoints('fitMichaelisMenten', 'rate', points, FITTED.length);
  const solution = fitCurveLeastSquares(
    michaelisMentenCurve,
    data,
    michaelisMentenInitialEstimate(data.x, data.y),
  );
  const vmax = solution.parameters[0];
  const km = solution.parameters[1];
  const df = points.length - FITTED.length;
  const covariance = parameterCovariance(solution.normalMatrix, FITTED.length, solution.rss / df);

  const derived: DerivedQuantity[] = [];
  if (enzymeConcentration !== undefined) {
    // kcat = Vmax/[E]; kcat/Km = Vmax/([E]·Km), ∇ = (1/([E]Km), −Vmax/([E]Km²)).
    derived.push(
      { spec: KCAT, value: vmax / enzymeConcentration, gradient: [1 / enzymeConcentration, 0] },
      {
        spec: KCAT_OVER_KM,
        value: vmax / (enzymeConcentration * km),
        gradient: [1 / (enzymeConcentration * km), -vmax / (enzymeConcentration * km * km)],
      },
    );
  }

  return summarizeFit({
    model: 'michaelis-menten',
    fitted: FITTED,
    values: [vmax, km],
    covariance,
    solution,
    weightRoot: data.weightRoot,
    derived,
  });
}
