/**
 * Numbers as the trade writes them, for the client's pages and the server's e-mails alike: kcat in s⁻¹,
 * Km in nM/µM/mM as fits, kcat/Km in M⁻¹ s⁻¹ in scientific notation, ΔΔG‡ in kJ/mol or kcal/mol with its
 * standard error. Inputs are SI-coherent values; negative numbers carry U+2212 MINUS SIGN rather than the
 * hyphen (common practice in typesetting), a power of ten is written `× 10ⁿ` with superscript figures and
 * a space separates number and unit (SI Brochure, 9th ed., 2019, section 5.4; section number from memory).
 */

import { JOULES_PER_CALORIE, type EnergyUnit } from '../kinetics/units';

const superscripts: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

// Plain decimals read best between these bounds; outside them a number is written a × 10ⁿ.
const PLAIN_DECIMAL_MIN = 0.01;
const PLAIN_DECIMAL_LIMIT = 10_000;

const minus = (text: string) => text.replace(/^-/, '−');

const isNumber = (value: number | null | undefined): value is number => value !== null && value !== undefined && Number.isFinite(value);

/**
 * A power of ten with its exponent in superscript figures, for axis labels and for values that share one
 * power of ten with their error.
 *
 * @param exponent a whole number
 * @returns e.g. `10⁻⁴`, `10⁰`, `10²¹`
 * @example powerOfTen(-4) // '10⁻⁴'
 */
export function powerOfTen(exponent: number): string {
  const figures = String(exponent)
    .split('')
    .map((character) => superscripts[character] ?? character)
    .join('');
  return `10${figures}`;
}

/** `toExponential` output (`1.23e-4`) as `1.23 × 10⁻⁴`. */
function scientific(exponential: string): string {
  const [mantissa, exponent] = exponential.split('e');
  return `${minus(mantissa)} × ${powerOfTen(Number(exponent))}`;
}

/**
 * A number to a given count of significant figures, in plain decimals from 0.01 to 10,000 and in
 * scientific notation (a × 10ⁿ) outside that range.
 *
 * @param value any number; null, undefined and non-finite values give `—`
 * @param digits significant figures
 * @returns e.g. `12.3`, `1.11 × 10⁻⁴`, `−2.53 × 10⁵`
 * @example formatNumber(0.000111) // '1.11 × 10⁻⁴'
 */
export function formatNumber(value: number | null | undefined, digits = 3): string {
  if (!isNumber(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= PLAIN_DECIMAL_MIN && magnitude < PLAIN_DECIMAL_LIMIT) return minus(Number(value.toPrecision(digits)).toString());
  return scientific(value.toExponential(digits - 1));
}

/**
 * A turnover number with its unit.
 *
 * @param perSecond kcat, s⁻¹
 * @returns e.g. `12.3 s⁻¹`, or `—` when there is none
 * @example formatKcat(12.34) // '12.3 s⁻¹'
 */
export function formatKcat(perSecond: number | null | undefined): string {
  return perSecond === null || perSecond === undefined ? '—' : `${formatNumber(perSecond)} s⁻¹`;
}

/**
 * A Michaelis constant in the unit (mM, µM or nM) that keeps the number between 1 and 1000 where it can.
 *
 * @param molar Km, M
 * @returns e.g. `25 µM`, or `—` when there is none
 * @example formatKm(2.5e-5) // '25 µM'
 */
export function formatKm(molar: number | null | undefined): string {
  if (!isNumber(molar)) return '—';
  if (molar >= 1e-3) return `${formatNumber(molar * 1e3)} mM`;
  if (molar >= 1e-6) return `${formatNumber(molar * 1e6)} µM`;
  return `${formatNumber(molar * 1e9)} nM`;
}

/**
 * A specificity constant, always in scientific notation with three significant figures.
 *
 * @param perMolarPerSecond kcat/Km, M⁻¹ s⁻¹
 * @returns e.g. `3.00 × 10⁴ M⁻¹ s⁻¹`, or `—` when there is none
 * @example formatKcatOverKm(921.4) // '9.21 × 10² M⁻¹ s⁻¹'
 */
export function formatKcatOverKm(perMolarPerSecond: number | null | undefined): string {
  if (!isNumber(perMolarPerSecond)) return '—';
  return `${scientific(perMolarPerSecond.toExponential(2))} M⁻¹ s⁻¹`;
}

/**
 * A molar energy in the wanted unit, with the thermochemical calorie (4.184 J exactly).
 *
 * @param kJPerMol the energy, kJ/mol
 * @param unit the wanted unit
 * @returns the energy in `unit`
 * @example energyIn(4.184, 'kcal/mol') // 1
 */
export function energyIn(kJPerMol: number, unit: EnergyUnit): number {
  return unit === 'kJ/mol' ? kJPerMol : kJPerMol / JOULES_PER_CALORIE;
}

/**
 * ΔΔG‡ and its standard error to two decimals in the wanted unit, without the unit (for a column
 * whose header names it).
 *
 * @param kJPerMol the energy, kJ/mol
 * @param seKJPerMol its standard error, kJ/mol; left out when null or not finite
 * @param unit the unit to write it in
 * @returns e.g. `−2.53 ± 0.18`, or `—` when there is no energy
 * @example formatEnergyFigures(5.708, 0.2, 'kcal/mol') // '1.36 ± 0.05'
 */
export function formatEnergyFigures(kJPerMol: number | null | undefined, seKJPerMol: number | null | undefined, unit: EnergyUnit): string {
  if (!isNumber(kJPerMol)) return '—';
  const value = minus(energyIn(kJPerMol, unit).toFixed(2));
  return isNumber(seKJPerMol) ? `${value} ± ${energyIn(seKJPerMol, unit).toFixed(2)}` : value;
}

/**
 * ΔΔG‡ with its standard error and unit.
 *
 * @param kJPerMol the energy, kJ/mol
 * @param seKJPerMol its standard error, kJ/mol; left out when null or not finite
 * @param unit the unit to write it in
 * @returns e.g. `−2.53 ± 0.18 kJ/mol`, or `—` when there is no energy
 * @example formatEnergy(-2.53, 0.18, 'kJ/mol') // '−2.53 ± 0.18 kJ/mol'
 */
export function formatEnergy(kJPerMol: number | null | undefined, seKJPerMol: number | null | undefined, unit: EnergyUnit): string {
  return isNumber(kJPerMol) ? `${formatEnergyFigures(kJPerMol, seKJPerMol, unit)} ${unit}` : '—';
}

/**
 * A fold change relative to the parent, to two significant figures.
 *
 * @param ratio variant over parent
 * @returns e.g. `2.6×`, `0.52×`, or `—` when there is none
 * @example formatFoldChange(2.63) // '2.6×'
 */
export function formatFoldChange(ratio: number | null | undefined): string {
  return isNumber(ratio) ? `${formatNumber(ratio, 2)}×` : '—';
}

/**
 * A pH to two decimals.
 *
 * @param ph the pH
 * @returns e.g. `7.50`, or `—` when there is none
 * @example formatPh(7.5) // '7.50'
 */
export function formatPh(ph: number | null | undefined): string {
  return isNumber(ph) ? ph.toFixed(2) : '—';
}
