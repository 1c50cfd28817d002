import { KineticsInputError } from './kinetics-input-error';
import type { RateWithError } from './types';

/**
 * Checks a rate constant with its standard error and returns its relative standard error, the quantity
 * that propagates into a free energy: se(ln k) ≈ se(k)/k (first-order delta method).
 *
 * Reference: Taylor, An Introduction to Error Analysis, 2nd ed. (1997), ch. 3.
 *
 * @param functionName the public function on whose behalf the check runs (it starts every message)
 * @param label which argument is checked, for the message (e.g. `variant`)
 * @param rate the rate constant (any unit, > 0) with its standard error (same unit, ≥ 0)
 * @throws {KineticsInputError} when the value is not finite and positive or the standard error is not
 *   finite and non-negative
 * @returns se/value, dimensionless
 * @example
 * validateRateWithError('deltaDeltaGActivation', 'variant', { value: 200, se: 10 }); // 0.05
 */
export function validateRateWithError(functionName: string, label: string, rate: RateWithError): number {
  if (!(Number.isFinite(rate.value) && rate.value > 0)) {
    throw new KineticsInputError(`${functionName} requires a finite, positive rate constant (${label})`);
  }
  if (!(Number.isFinite(rate.se) && rate.se >= 0)) {
    throw new KineticsInputError(`${functionName} requires a finite, non-negative standard error (${label})`);
  }
  return rate.se / rate.value;
}
