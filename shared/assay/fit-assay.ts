import { deltaMethodEstimate } from '../kinetics/delta-method-estimate';
import { fitHill } from '../kinetics/fit-hill';
import { fitMichaelisMenten } from '../kinetics/fit-michaelis-menten';
import { fitSubstrateInhibition } from '../kinetics/fit-substrate-inhibition';
import type { Estimate, FitResult } from '../kinetics/types';
import { convertUnit } from '../kinetics/units';
import {
  canonicalConcentrationUnit,
  toMolar,
  toMolarPerSecond,
  type ConcentrationUnitInput,
  type KineticModelName,
  type RateUnitInput,
} from '../schemas/assay';

/** One rate point as entered, in the assay's units. */
export type EnteredRatePoint = { s: number; v: number; excluded?: boolean };

/** Parameters of an assay fit in SI-coherent units. */
export type AssayFitParameters = {
  /** Vmax, M s⁻¹. */
  vmax: Estimate;
  /** Km (K½ for the Hill model), M. */
  km: Estimate;
  /** kcat = Vmax/[E]t, s⁻¹. */
  kcat: Estimate;
  /** kcat/Km, M⁻¹ s⁻¹; null for the Hill model, where kcat/K½ is no second-order rate constant unless n = 1. */
  kcatOverKm: Estimate | null;
  /** Ki, M (substrate inhibition). */
  ki: Estimate | null;
  /** Hill coefficient (Hill model), dimensionless. */
  hill: Estimate | null;
};

/** The outcome of {@link fitAssay}. */
export type AssayFit = {
  model: KineticModelName;
  parameters: AssayFitParameters;
  /** Residual standard deviation, M s⁻¹. */
  residualSdMolarPerSecond: number;
  degreesOfFreedom: number;
  /** Points that entered the fit. */
  pointCount: number;
  /** Substrate concentrations of the points that entered the fit, M. */
  substrateMolar: number[];
  converged: boolean;
  warnings: string[];
  /** Fitted parameters (Vmax, Km, Ki, n…) that came out zero or negative: the model does not describe the data. */
  nonPositive: string[];
  /** The engine's result in the entered units, for plots of the curve over the points as typed. */
  fit: FitResult;
};

const FITTED_NAMES: Record<KineticModelName, string[]> = {
  'michaelis-menten': ['vmax', 'km'],
  'substrate-inhibition': ['vmax', 'km', 'ki'],
  hill: ['vmax', 'khalf', 'hill'],
};

/**
 * Fits an assay's initial rates as entered (S in `sUnit`, v in `vUnit`) with the chosen model and reports
 * the parameters in SI-coherent units, with kcat = Vmax/[E]t. Excluded points stay out of the fit.
 *
 * The fit runs in the entered units, exactly as a live preview in the browser does, so that both give the
 * same numbers; only the results are converted, each by one exact factor (a linear change of unit scales an
 * estimate, its standard error and its interval alike). kcat/Km comes from the engine's delta method over the
 * full covariance of Vmax and Km (Michaelis–Menten: fitMichaelisMenten; substrate inhibition: the same
 * gradient over the 3 × 3 covariance), never from independent errors.
 *
 * Reference: Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012) (kcat = V/[E]₀);
 * Bates & Watts, Nonlinear Regression Analysis and Its Applications (1988), ch. 2 (delta method).
 *
 * @param points the rate points as entered; never modified
 * @param options.model michaelis-menten, substrate-inhibition or hill
 * @param options.sUnit unit of S
 * @param options.vUnit unit of v (concentration per time)
 * @param options.enzymeConcentration total enzyme concentration with its unit (> 0)
 * @throws {KineticsInputError} when the points that are not excluded cannot be fitted (too few distinct S,
 *   all v zero, …) or the enzyme concentration is not a finite positive number
 * @returns SI parameters, fit statistics, warnings and the raw fit
 * @example
 * // Puromycin, treated (Bates & Watts 1988), read as mM and µM/min with 10 nM enzyme:
 * // Vmax = 212.68 µM/min = 3.5447e-6 M/s, Km = 0.06412 mM = 6.412e-5 M, kcat = 21268 min⁻¹ = 354.47 s⁻¹.
 * fitAssay(points, { model: 'michaelis-menten', sUnit: 'mM', vUnit: 'µM/min', enzymeConcentration: { value: 10, unit: 'nM' } })
 *   .parameters.kcat.value; // 354.472…
 */
export function fitAssay(
  points: readonly EnteredRatePoint[],
  options: {
    model: KineticModelName;
    sUnit: ConcentrationUnitInput;
    vUnit: RateUnitInput;
    enzymeConcentration: { value: number; unit: ConcentrationUnitInput };
  },
): AssayFit {
  const used = points.filter((point) => !point.excluded).map((point) => ({ s: point.s, v: point.v }));
  const [vConcentrationUnit, vTimeUnit] = options.vUnit.split('/') as [ConcentrationUnitInput, 's' | 'min'];
  // [E]t in the concentration unit of v's numerator, so that Vmax/[E]t is per time unit of v.
  const enzyme = convertUnit(
    options.enzymeConcentration.value,
    canonicalConcentrationUnit(options.enzymeConcentration.unit),
    canonicalConcentrationUnit(vConcentrationUnit),
  );

  // Each result converts by one factor: a linear change of unit scales an estimate, its SE and interval alike.
  const rateFactor = toMolarPerSecond(1, options.vUnit);
  const concentrationFactor = toMolar(1, options.sUnit);
  const perTimeFactor = vTimeUnit === 'min' ? convertUnit(1, '1/min', '1/s') : 1;
  const perConcentrationFactor = convertUnit(1, 'M', canonicalConcentrationUnit(options.sUnit));

  let fit: FitResult;
  let kcat: Estimate;
  let kcatOverKm: Estimate | null;
  if (options.model === 'michaelis-menten') {
    fit = fitMichaelisMenten(used, { enzymeConcentration: enzyme });
    kcat = fit.parameters.kcat;
    kcatOverKm = fit.parameters.kcatOverKm;
  } else {
    fit = options.model === 'substrate-inhibition' ? fitSubstrateInhibition(used) : fitHill(used);
    kcat = scale(fit.parameters.vmax, 1 / enzyme);
    kcatOverKm = options.model === 'substrate-inhibition' ? substrateInhibitionSpecificity(fit, enzyme) : null;
  }

  const kmName = options.model === 'hill' ? 'khalf' : 'km';
  const parameters: AssayFitParameters = {
    vmax: scale(fit.parameters.vmax, rateFactor),
    km: scale(fit.parameters[kmName], concentrationFactor),
    kcat: scale(kcat, perTimeFactor),
    kcatOverKm: kcatOverKm === null ? null : scale(kcatOverKm, perTimeFactor * perConcentrationFactor),
    ki: options.model === 'substrate-inhibition' ? scale(fit.parameters.ki, concentrationFactor) : null,
    hill: options.model === 'hill' ? fit.parameters.hill : null,
  };
  return {
    model: options.model,
    parameters,
    residualSdMolarPerSecond: fit.residualSd * rateFactor,
    degreesOfFreedom: fit.df,
    pointCount: used.length,
    substrateMolar: used.map((point) => point.s * concentrationFactor),
    converged: fit.converged,
    warnings: fit.warnings,
    nonPositive: FITTED_NAMES[options.model].filter((name) => !(fit.parameters[name].value > 0)),
    fit,
  };
}

/** kcat/Km = Vmax/([E]·Km) of a substrate-inhibition fit, by the delta method over its covariance. */
function substrateInhibitionSpecificity(fit: FitResult, enzyme: number): Estimate {
  const vmax = fit.parameters.vmax.value;
  const km = fit.parameters.km.value;
  const finite = fit.covariance.every((row) => row.every(Number.isFinite));
  // ∇ over (Vmax, Km, Ki) in the covariance's order.
  const gradient = [1 / (enzyme * km), -vmax / (enzyme * km * km), 0];
  return deltaMethodEstimate(vmax / (enzyme * km), gradient, finite ? fit.covariance : null, fit.df);
}

/** An estimate in another unit: value, standard error and interval all scale by the positive factor. */
function scale(estimate: Estimate, factor: number): Estimate {
  return {
    value: estimate.value * factor,
    se: estimate.se * factor,
    ci95: [estimate.ci95[0] * factor, estimate.ci95[1] * factor],
  };
}
