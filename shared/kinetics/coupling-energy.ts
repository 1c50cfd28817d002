import { freeEnergyFromLogRatio } from './free-energy-from-log-ratio';
import type { FreeEnergyDifference, RateWithError } from './types';
import { validateRateWithError } from './validate-rate-with-error';
import { validateTemperature } from './validate-temperature';

/**
 * Coupling (interaction) energy of two mutations from a double-mutant cycle,
 * ΔΔG_int = ΔΔG‡(AB) − ΔΔG‡(A) − ΔΔG‡(B) = −RT·ln(k_AB·k_parent/(k_A·k_B)): zero when the mutations act
 * independently; negative when the double mutant is faster than additivity predicts, as when two residues
 * interact so that removing either one already loses the interaction; positive when it is slower.
 *
 * The standard error comes from the four rate constants directly, RT·√(Σ (se/k)²), taken as independent
 * measurements. Combining the three ΔΔG‡ errors instead would count the parent's error three times,
 * although it enters ln(k_AB·k_P/(k_A·k_B)) once.
 *
 * Reference: Carter, Winter, Wilkinson & Fersht, Cell 38 (1984) 835; Horovitz, Folding & Design 1 (1996)
 * R121.
 *
 * @param rates.parent the parent's rate constant (kcat/Km or kcat) with its standard error
 * @param rates.a single mutant A, same kind and unit
 * @param rates.b single mutant B, same kind and unit
 * @param rates.ab double mutant AB, same kind and unit
 * @param temperatureKelvin assay temperature, K
 * @throws {KineticsInputError} a rate constant that is not finite and positive, a standard error that is
 *   not finite and non-negative, or a temperature that is not finite and positive
 * @returns ΔΔG_int with its standard error in kJ/mol and kcal/mol
 * @example
 * // Each single mutation is tenfold slower, and so is the double: the effects are not additive.
 * const exact = (value: number) => ({ value, se: 0 });
 * couplingEnergy({ parent: exact(100), a: exact(10), b: exact(10), ab: exact(10) }, 298.15).kJPerMol.value;
 * // −5.708010 (= −RT·ln 10)
 */
export function couplingEnergy(
  rates: { parent: RateWithError; a: RateWithError; b: RateWithError; ab: RateWithError },
  temperatureKelvin: number,
): FreeEnergyDifference {
  const relativeSe = [
    validateRateWithError('couplingEnergy', 'parent', rates.parent),
    validateRateWithError('couplingEnergy', 'a', rates.a),
    validateRateWithError('couplingEnergy', 'b', rates.b),
    validateRateWithError('couplingEnergy', 'ab', rates.ab),
  ];
  validateTemperature('couplingEnergy', temperatureKelvin);
  // ln(k_AB·k_P/(k_A·k_B)) as a sum of logarithms, which cannot overflow.
  const logRatio =
    Math.log(rates.ab.value) + Math.log(rates.parent.value) - Math.log(rates.a.value) - Math.log(rates.b.value);
  return freeEnergyFromLogRatio(logRatio, Math.hypot(...relativeSe), temperatureKelvin);
}
