import { freeEnergyFromLogRatio } from './free-energy-from-log-ratio';
import type { FreeEnergyDifference, RateWithError } from './types';
import { validateRateWithError } from './validate-rate-with-error';
import { validateTemperature } from './validate-temperature';

/**
 * Change in activation free energy of a variant relative to its parent, ΔΔG‡ = −RT·ln(k_variant/k_parent),
 * positive when the variant is slower. With kcat/Km it compares the transition state with free enzyme and
 * substrate; with kcat, with the enzyme–substrate complex. The standard error propagates the two relative
 * standard errors, taken as independent (separate measurements): se = RT·√((se_v/k_v)² + (se_p/k_p)²).
 *
 * The temperature is the assay's, not a fixed 25 °C.
 *
 * Reference: Fersht, Structure and Mechanism in Protein Science (1999) (ΔΔG‡ from rate ratios);
 * Wells, Biochemistry 29 (1990) 8509.
 *
 * @param variant the variant's rate constant (kcat/Km or kcat) with its standard error
 * @param parent the parent's rate constant of the same kind and unit, with its standard error
 * @param temperatureKelvin assay temperature, K
 * @throws {KineticsInputError} a rate constant that is not finite and positive, a standard error that is
 *   not finite and non-negative, or a temperature that is not finite and positive
 * @returns ΔΔG‡ with its standard error in kJ/mol and kcal/mol
 * @example
 * // A tenfold slower variant at 25 °C: +RT·ln 10.
 * deltaDeltaGActivation({ value: 1, se: 0 }, { value: 10, se: 0 }, 298.15).kJPerMol.value; // 5.708010
 */
export function deltaDeltaGActivation(
  variant: RateWithError,
  parent: RateWithError,
  temperatureKelvin: number,
): FreeEnergyDifference {
  const variantRelativeSe = validateRateWithError('deltaDeltaGActivation', 'variant', variant);
  const parentRelativeSe = validateRateWithError('deltaDeltaGActivation', 'parent', parent);
  validateTemperature('deltaDeltaGActivation', temperatureKelvin);
  return freeEnergyFromLogRatio(
    Math.log(variant.value / parent.value),
    Math.hypot(variantRelativeSe, parentRelativeSe),
    temperatureKelvin,
  );
}
