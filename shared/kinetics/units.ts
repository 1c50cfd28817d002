import { KineticsInputError } from './kinetics-input-error';

/** Molar gas constant R = N_A·k in J mol⁻¹ K⁻¹, exact since the 2019 SI redefinition (CODATA 2018). */
export const GAS_CONSTANT = 8.31446261815324;

/** Joules in one thermochemical calorie, exact by definition (the calorie of kcal/mol in biochemistry). */
export const JOULES_PER_CALORIE = 4.184;

/** 0 °C in kelvin, exact by the definition of the Celsius scale: t/°C = T/K − 273.15 (SI Brochure, 9th ed., 2019, section 2.3.1). */
export const ZERO_CELSIUS_KELVIN = 273.15;

/** Concentration units; µ is U+00B5 MICRO SIGN. */
export type ConcentrationUnit = 'M' | 'mM' | 'µM' | 'nM';
/** First-order rate-constant units (kcat, v₀/[E]). */
export type RateUnit = '1/s' | '1/min';
/** Molar energy units. */
export type EnergyUnit = 'kJ/mol' | 'kcal/mol';

// Powers of ten for concentrations, so that a conversion is one exact multiplication or division by 10ⁿ.
const CONCENTRATION_EXPONENT: Record<ConcentrationUnit, number> = { M: 0, mM: -3, 'µM': -6, nM: -9 };
// Size of each unit in s⁻¹ and in J/mol.
const RATE_IN_PER_SECOND: Record<RateUnit, number> = { '1/s': 1, '1/min': 1 / 60 };
const ENERGY_IN_JOULES_PER_MOL: Record<EnergyUnit, number> = { 'kJ/mol': 1000, 'kcal/mol': 1000 * JOULES_PER_CALORIE };

/**
 * Unit conversion for the quantities the engine reports: concentrations (M, mM, µM, nM), first-order rate
 * constants (per second, per minute) and molar energies (kJ/mol, kcal/mol with the thermochemical calorie,
 * 4.184 J exactly). The application stores SI-coherent values (M, s⁻¹, J/mol) and converts only at the edges.
 *
 * Reference: BIPM, The International System of Units, 9th ed. (2019); IUPAC Green Book, 3rd ed. (2007),
 * §7.2 (thermochemical calorie).
 *
 * @param value the quantity in unit `from`
 * @param from its unit
 * @param to the wanted unit, of the same kind
 * @throws {KineticsInputError} when `value` is not finite or the units are not of the same kind
 * @returns the quantity in unit `to`
 * @example
 * convertUnit(250, 'µM', 'mM'); // 0.25
 * convertUnit(1, 'kcal/mol', 'kJ/mol'); // 4.184
 * convertUnit(120, '1/min', '1/s'); // 2
 */
export function convertUnit(value: number, from: ConcentrationUnit, to: ConcentrationUnit): number;
export function convertUnit(value: number, from: RateUnit, to: RateUnit): number;
export function convertUnit(value: number, from: EnergyUnit, to: EnergyUnit): number;
export function convertUnit(
  value: number,
  from: ConcentrationUnit | RateUnit | EnergyUnit,
  to: ConcentrationUnit | RateUnit | EnergyUnit,
): number {
  if (!Number.isFinite(value)) {
    throw new KineticsInputError('convertUnit requires a finite value');
  }
  if (from in CONCENTRATION_EXPONENT && to in CONCENTRATION_EXPONENT) {
    const exponent =
      CONCENTRATION_EXPONENT[from as ConcentrationUnit] - CONCENTRATION_EXPONENT[to as ConcentrationUnit];
    // Dividing by 10³ rather than multiplying by 10⁻³ keeps 1 mM → 0.001 M correctly rounded.
    return exponent >= 0 ? value * 10 ** exponent : value / 10 ** -exponent;
  }
  if (from in RATE_IN_PER_SECOND && to in RATE_IN_PER_SECOND) {
    return (value * RATE_IN_PER_SECOND[from as RateUnit]) / RATE_IN_PER_SECOND[to as RateUnit];
  }
  if (from in ENERGY_IN_JOULES_PER_MOL && to in ENERGY_IN_JOULES_PER_MOL) {
    return (value * ENERGY_IN_JOULES_PER_MOL[from as EnergyUnit]) / ENERGY_IN_JOULES_PER_MOL[to as EnergyUnit];
  }
  throw new KineticsInputError('convertUnit requires units of the same kind');
}
