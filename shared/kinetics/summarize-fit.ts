import { deltaMethodEstimate } from './delta-method-estimate';
import type { LevenbergMarquardtResult } from './levenberg-marquardt';
import type { CurveModelName, Estimate, FitResult } from './types';

/**
 * How a reported quantity is judged: `mustBePositive` for quantities that are positive by their physics
 * (Vmax, Km, Ki, kmax); `scale` `'ratio'` for quantities judged by their relative standard error and `'ph'`
 * for pKa values, whose standard error is judged in pH units (a relative error of a logarithm means little).
 */
export type QuantitySpec = { name: string; mustBePositive: boolean; scale: 'ratio' | 'ph' };

/** A quantity derived from the fitted parameters, with its gradient for the delta method. */
export type DerivedQuantity = { spec: QuantitySpec; value: number; gradient: readonly number[] };

/** A relative standard error above this (50 %) makes a ratio-scale quantity "poorly determined". */
export const POORLY_DETERMINED_RELATIVE_SE = 0.5;
/** A pKa standard error above this (half a pH unit, a factor of about 3 in Ka) makes it "poorly determined". */
export const POORLY_DETERMINED_PH_SE = 0.5;

/**
 * Builds the public result of a least-squares fit: estimates with standard errors and Wald 95 % intervals,
 * derived quantities by the delta method, unweighted residuals, and the warnings that keep a number from
 * being silently wrong (non-convergence, singular JᵀJ, a physically positive quantity that is not,
 * a poorly determined quantity).
 *
 * Reference: Bates & Watts, Nonlinear Regression Analysis and Its Applications (1988), ch. 2.
 *
 * @param input.model the model's name
 * @param input.fitted specs of the fitted parameters, in the order of the covariance rows
 * @param input.values reported values of the fitted parameters (units of the model's parameters)
 * @param input.covariance their covariance s²(JᵀJ)⁻¹ (in the reported parametrisation), or null if singular
 * @param input.solution the solver's result (RSS, iterations, weighted residuals, convergence)
 * @param input.weightRoot √wᵢ, or null for an unweighted fit, to turn residuals back into response units
 * @param input.derived quantities computed from the parameters (e.g. kcat), added to `parameters`
 * @throws {KineticsInputError} only if n − p < 1, which point validation already rules out
 * @returns the {@link FitResult}
 * @example
 * // See fitMichaelisMenten: summarizeFit turns the solver's Misra1d answer into
 * // parameters.vmax = { value: 437.3697…, se: 3.6489…, ci95: [429.42…, 445.32…] }.
 */
export function summarizeFit(input: {
  model: CurveModelName;
  fitted: readonly QuantitySpec[];
  values: readonly number[];
  covariance: number[][] | null;
  solution: LevenbergMarquardtResult;
  weightRoot: number[] | null;
  derived?: readonly DerivedQuantity[];
}): FitResult {
  const { model, fitted, values, covariance, solution, weightRoot } = input;
  const n = solution.residuals.length;
  const p = fitted.length;
  const df = n - p;
  const warnings: string[] = [];

  if (!solution.converged) {
    warnings.push(
      `the fit did not converge (stopped after ${solution.iterations} iterations); the estimates are not reliable`,
    );
  }
  if (covariance === null) {
    warnings.push(
      'JᵀJ is singular: the parameters cannot all be determined from these data, so their standard errors are infinite',
    );
  }

  const parameters: Record<string, Estimate> = {};
  const unitGradient = new Array<number>(p).fill(0);
  for (let j = 0; j < p; j += 1) {
    unitGradient[j] = 1;
    parameters[fitted[j].name] = deltaMethodEstimate(values[j], unitGradient, covariance, df);
    unitGradient[j] = 0;
    judge(fitted[j], parameters[fitted[j].name], covariance !== null, warnings);
  }
  for (const quantity of input.derived ?? []) {
    parameters[quantity.spec.name] = deltaMethodEstimate(quantity.value, quantity.gradient, covariance, df);
    judge(quantity.spec, parameters[quantity.spec.name], covariance !== null, warnings);
  }

  // Residuals in response units: the solver's are √wᵢ·(yᵢ − fᵢ).
  const residuals = new Array<number>(n);
  for (let i = 0; i < n; i += 1) {
    residuals[i] = weightRoot === null ? solution.residuals[i] : solution.residuals[i] / weightRoot[i];
  }

  return {
    model,
    parameters,
    fittedParameters: fitted.map((spec) => spec.name),
    covariance:
      covariance ?? fitted.map(() => new Array<number>(p).fill(Number.POSITIVE_INFINITY)),
    rss: solution.rss,
    residualSd: Math.sqrt(solution.rss / df),
    df,
    n,
    iterations: solution.iterations,
    converged: solution.converged,
    residuals,
    warnings,
  };
}

/** Adds the warnings one estimate deserves. */
function judge(spec: QuantitySpec, estimate: Estimate, determined: boolean, warnings: string[]): void {
  if (spec.mustBePositive && !(estimate.value > 0)) {
    warnings.push(
      `${spec.name} is not positive (${format(estimate.value)}); the model does not describe these data`,
    );
  }
  // With a singular JᵀJ every standard error is infinite and one warning already says so.
  if (!determined) return;
  if (spec.scale === 'ph') {
    if (estimate.se > POORLY_DETERMINED_PH_SE) {
      warnings.push(`${spec.name} is poorly determined: its standard error is ${format(estimate.se)} pH units`);
    }
    return;
  }
  const relativeSe = estimate.se / Math.abs(estimate.value);
  if (relativeSe > POORLY_DETERMINED_RELATIVE_SE) {
    warnings.push(
      `${spec.name} is poorly determined: its standard error is ${format(100 * relativeSe)} % of its value`,
    );
  }
}

function format(value: number): string {
  return Number.isFinite(value) ? Number(value.toPrecision(3)).toString() : String(value);
}
