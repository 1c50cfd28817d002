/**
 * One initial-rate measurement: substrate concentration `s` and initial rate `v`, in whatever
 * consistent units the caller uses (the fit reports Vmax in the unit of `v` and Km in the unit of `s`).
 * `weight` is a least-squares weight (1/σ², not σ); either every point of a data set has one or none does.
 */
export type RatePoint = { s: number; v: number; weight?: number };

/** One rate constant measured at one pH, with an optional least-squares weight (1/σ²). */
export type PhPoint = { ph: number; k: number; weight?: number };

/**
 * A fitted or derived quantity with its standard error and Wald 95 % confidence interval
 * (value ± t(0.975, df)·se). `se` is `Infinity` (and the interval unbounded) only when JᵀJ is
 * singular, in which case the fit also carries a warning; it is never NaN.
 */
export type Estimate = { value: number; se: number; ci95: [number, number] };

/** Models the engine fits; the name tells a consumer how to evaluate the curve. */
export type CurveModelName =
  | 'michaelis-menten'
  | 'substrate-inhibition'
  | 'hill'
  | 'ph-bell'
  | 'ph-acid'
  | 'ph-base';

/**
 * The result of a nonlinear least-squares fit.
 *
 * - `parameters`: every reported estimate; fitted ones plus derived ones (e.g. `kcat`).
 * - `fittedParameters`: the names of the fitted parameters, in the order of `covariance`'s rows.
 * - `covariance`: s²(JᵀJ)⁻¹ of the fitted parameters, s² = rss/df.
 * - `rss`: the (weighted, if weights were given) residual sum of squares.
 * - `residualSd`: √(rss/df).
 * - `residuals`: observed − fitted for each point in input order, in the unit of the response, unweighted.
 * - `warnings`: plain-language reasons not to trust a number; empty when nothing is wrong.
 */
export type FitResult = {
  model: CurveModelName;
  parameters: Record<string, Estimate>;
  fittedParameters: string[];
  covariance: number[][];
  rss: number;
  residualSd: number;
  df: number;
  n: number;
  iterations: number;
  converged: boolean;
  residuals: number[];
  warnings: string[];
};

/** A rate constant (kcat/Km or kcat) with its standard error, as input to free-energy arithmetic. */
export type RateWithError = { value: number; se: number };

/** A free-energy difference with its standard error in both common units. */
export type FreeEnergyDifference = {
  kJPerMol: { value: number; se: number };
  kcalPerMol: { value: number; se: number };
};

/**
 * A model curve evaluated at every x at once: writes f(xᵢ; θ) into `values` and, when `jacobian` is
 * given, ∂f(xᵢ; θ)/∂θⱼ row-major into it (n × p). A θ outside the model's domain gives NaN values.
 */
export type CurveFunction = (
  x: ArrayLike<number>,
  parameters: ArrayLike<number>,
  values: number[],
  jacobian: number[] | null,
) => void;
