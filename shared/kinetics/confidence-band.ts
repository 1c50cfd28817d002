import { hillCurve } from './hill-curve';
import { KineticsInputError } from './kinetics-input-error';
import { michaelisMentenCurve } from './michaelis-menten-curve';
import { phAcidCurve } from './ph-acid-curve';
import { phBaseCurve } from './ph-base-curve';
import { phBellCurve } from './ph-bell-curve';
import { studentTCritical95 } from './student-t-critical-95';
import { substrateInhibitionCurve } from './substrate-inhibition-curve';
import type { CurveFunction, CurveModelName, FitResult } from './types';

const CURVES: Record<CurveModelName, { curve: CurveFunction; axis: 'substrate' | 'ph' }> = {
  'michaelis-menten': { curve: michaelisMentenCurve, axis: 'substrate' },
  'substrate-inhibition': { curve: substrateInhibitionCurve, axis: 'substrate' },
  hill: { curve: hillCurve, axis: 'substrate' },
  'ph-bell': { curve: phBellCurve, axis: 'ph' },
  'ph-acid': { curve: phAcidCurve, axis: 'ph' },
  'ph-base': { curve: phBaseCurve, axis: 'ph' },
};

/** One point of a fitted curve with its pointwise 95 % confidence band. */
export type BandPoint = { x: number; y: number; lower: number; upper: number };

/**
 * The fitted curve and its pointwise 95 % confidence band (for the mean response, not for new
 * observations): ŷ(x) ± t(0.975, df)·√(∇ŷᵀ·C·∇ŷ), with ∇ŷ the model's gradient with respect to the fitted
 * parameters at x and C their covariance (delta method). Used to draw a fit with its uncertainty.
 *
 * Reference: Bates & Watts, Nonlinear Regression Analysis and Its Applications (1988), ch. 2 (linear
 * approximation inference bands).
 *
 * @param fit a fit from this engine (its `model` says which curve to evaluate)
 * @param x where to evaluate: substrate concentrations (≥ 0, unit of the fit's S) or pH values
 * @throws {KineticsInputError} when the fit's covariance is not finite (JᵀJ was singular, so there is no
 *   band), an x value is not finite (or, for a rate model, negative), or the curve is not finite there
 *   (a pole of a fit with negative Km, or a pH so extreme that 10^(pKa − pH) overflows)
 * @returns for each x: the fitted value and the band's lower and upper limits, in the unit of the response
 * @example
 * // Puromycin fit (Vmax = 212.68, Km = 0.06412): at S = Km the curve is at Vmax/2.
 * confidenceBand(puromycinFit, [0.06412128168])[0].y; // 106.3418…
 */
export function confidenceBand(fit: FitResult, x: readonly number[]): BandPoint[] {
  const { curve, axis } = CURVES[fit.model];
  const p = fit.fittedParameters.length;
  if (!fit.covariance.every((row) => row.every(Number.isFinite))) {
    throw new KineticsInputError('confidenceBand requires a fit with a finite covariance');
  }
  for (const xi of x) {
    if (!Number.isFinite(xi) || (axis === 'substrate' && xi < 0)) {
      throw new KineticsInputError(
        axis === 'substrate'
          ? 'confidenceBand requires finite, non-negative substrate concentrations'
          : 'confidenceBand requires finite pH values',
      );
    }
  }

  const parameters = fit.fittedParameters.map((name) => fit.parameters[name].value);
  // The substrate-inhibition curve is written in u = 1/Ki; the chain rule dv/dKi = dv/du·(−1/Ki²) brings
  // its gradient back to the Ki of the covariance.
  const inverseKiIndex = fit.model === 'substrate-inhibition' ? 2 : -1;
  if (inverseKiIndex >= 0) parameters[inverseKiIndex] = 1 / parameters[inverseKiIndex];

  const values = new Array<number>(x.length).fill(0);
  const jacobian = new Array<number>(x.length * p).fill(0);
  curve(x, parameters, values, jacobian);
  const criticalValue = studentTCritical95(fit.df);

  const band: BandPoint[] = [];
  for (let i = 0; i < x.length; i += 1) {
    if (!Number.isFinite(values[i])) {
      throw new KineticsInputError('confidenceBand requires x values at which the fitted curve is finite');
    }
    const gradient = jacobian.slice(i * p, (i + 1) * p);
    if (inverseKiIndex >= 0) gradient[inverseKiIndex] *= -(parameters[inverseKiIndex] ** 2);
    let variance = 0;
    for (let j = 0; j < p; j += 1) {
      for (let k = 0; k < p; k += 1) variance += gradient[j] * gradient[k] * fit.covariance[j][k];
    }
    const halfWidth = criticalValue * Math.sqrt(Math.max(variance, 0));
    band.push({ x: x[i], y: values[i], lower: values[i] - halfWidth, upper: values[i] + halfWidth });
  }
  return band;
}
