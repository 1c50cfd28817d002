import { confidenceBand, type BandPoint } from '@shared/kinetics/confidence-band';
import { KineticsInputError } from '@shared/kinetics/kinetics-input-error';
import type { FitResult } from '@shared/kinetics/types';

/** A fitted curve to draw: its points and whether they carry a real 95 % band. */
export interface FittedCurve {
  points: BandPoint[];
  /** False when the fit's covariance is singular: the curve is drawn, the band is not. */
  hasBand: boolean;
}

/**
 * The fitted curve with its pointwise 95 % band at `x` (shared/kinetics/confidence-band, the same
 * computation the server would make). A singular fit has no band; its curve is still drawn, evaluated
 * with a zero covariance so that the model's own curve function is used and not a copy of it here.
 *
 * @param fit a fit from the kinetics engine, in the units of the data as entered
 * @param x where to evaluate
 * @returns the curve points (empty when the curve is not finite there) and whether there is a band
 */
export function fittedCurve(fit: FitResult, x: readonly number[]): FittedCurve {
  try {
    return { points: confidenceBand(fit, x), hasBand: true };
  } catch (error) {
    if (!(error instanceof KineticsInputError)) throw error;
  }
  try {
    const zero = fit.covariance.map((row) => row.map(() => 0));
    return { points: confidenceBand({ ...fit, covariance: zero }, x), hasBand: false };
  } catch (error) {
    if (error instanceof KineticsInputError) return { points: [], hasBand: false };
    throw error;
  }
}
