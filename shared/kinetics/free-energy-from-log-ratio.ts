import { GAS_CONSTANT, JOULES_PER_CALORIE } from './units';
import type { FreeEnergyDifference } from './types';

/**
 * Free-energy difference −RT·L from a natural-log rate ratio L = ln(k₁/k₂) and its standard error, in
 * kJ/mol and kcal/mol: the transition-state theory link between a rate ratio and ΔΔG‡ (the transmission
 * coefficient and kT/h cancel in the ratio).
 *
 * Reference: Eyring, J. Chem. Phys. 3 (1935) 107; Fersht, Structure and Mechanism in Protein Science
 * (1999).
 *
 * @param logRatio ln of the rate ratio, dimensionless
 * @param logRatioSe its standard error (≈ the relative standard error of the ratio), dimensionless
 * @param temperatureKelvin absolute temperature T, K (already validated by the caller)
 * @throws never
 * @returns −RT·L with standard error RT·se(L), in kJ/mol and kcal/mol
 * @example
 * freeEnergyFromLogRatio(-Math.LN10, 0, 298.15).kJPerMol.value; // 5.7080095… (RT ln 10 at 25 °C)
 */
export function freeEnergyFromLogRatio(
  logRatio: number,
  logRatioSe: number,
  temperatureKelvin: number,
): FreeEnergyDifference {
  const rtJoulesPerMol = GAS_CONSTANT * temperatureKelvin;
  const valueJoulesPerMol = -rtJoulesPerMol * logRatio;
  const seJoulesPerMol = rtJoulesPerMol * logRatioSe;
  return {
    kJPerMol: { value: valueJoulesPerMol / 1000, se: seJoulesPerMol / 1000 },
    kcalPerMol: {
      value: valueJoulesPerMol / (1000 * JOULES_PER_CALORIE),
      se: seJoulesPerMol / (1000 * JOULES_PER_CALORIE),
    },
  };
}
