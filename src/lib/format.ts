/**
 * Numbers as the trade writes them: kcat in s⁻¹, Km in nM/µM/mM as fits, kcat/Km in M⁻¹ s⁻¹ with
 * scientific notation, ΔΔG‡ in kJ/mol or kcal/mol. Inputs are SI values from the API; the minus sign
 * is U+2212 and figures are meant for tabular-number cells.
 */

import type { EnergyUnit } from '@shared/schemas/auth';

const superscripts: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };
const JOULES_PER_CALORIE = 4.184;

const minus = (text: string) => text.replace(/^-/, '−');

/** `value` to `digits` significant figures, in scientific notation (a × 10ⁿ) outside 0.01–10,000. */
export function formatNumber(value: number | null | undefined, digits = 3): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 0.01 && magnitude < 10_000) return minus(Number(value.toPrecision(digits)).toString());
  const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
  const power = Number(exponent).toString().split('').map((character) => superscripts[character] ?? character).join('');
  return `${minus(mantissa)} × 10${power}`;
}

export function formatKcat(perSecond: number | null | undefined): string {
  return perSecond === null || perSecond === undefined ? '—' : `${formatNumber(perSecond)} s⁻¹`;
}

/** Km in the unit that keeps the number between 1 and 1000 where possible. */
export function formatKm(molar: number | null | undefined): string {
  if (molar === null || molar === undefined || !Number.isFinite(molar)) return '—';
  if (molar >= 1e-3) return `${formatNumber(molar * 1e3)} mM`;
  if (molar >= 1e-6) return `${formatNumber(molar * 1e6)} µM`;
  return `${formatNumber(molar * 1e9)} nM`;
}

export function formatKcatOverKm(perMolarPerSecond: number | null | undefined): string {
  if (perMolarPerSecond === null || perMolarPerSecond === undefined || !Number.isFinite(perMolarPerSecond)) return '—';
  const [mantissa, exponent] = perMolarPerSecond.toExponential(2).split('e');
  const power = Number(exponent).toString().split('').map((character) => superscripts[character] ?? character).join('');
  return `${minus(mantissa)} × 10${power} M⁻¹ s⁻¹`;
}

/** Converts kJ/mol to the wanted unit. */
export function energyIn(kJPerMol: number, unit: EnergyUnit): number {
  return unit === 'kJ/mol' ? kJPerMol : kJPerMol / JOULES_PER_CALORIE;
}

/** ΔΔG‡ with its standard error, e.g. `−2.53 ± 0.18 kJ/mol`. */
export function formatEnergy(kJPerMol: number | null | undefined, seKJPerMol: number | null | undefined, unit: EnergyUnit): string {
  if (kJPerMol === null || kJPerMol === undefined || !Number.isFinite(kJPerMol)) return '—';
  const value = energyIn(kJPerMol, unit).toFixed(2);
  const se = seKJPerMol === null || seKJPerMol === undefined || !Number.isFinite(seKJPerMol) ? null : energyIn(seKJPerMol, unit).toFixed(2);
  return `${minus(value)}${se ? ` ± ${se}` : ''} ${unit}`;
}

/** A fold change relative to the parent, e.g. `2.6×`. */
export function formatFoldChange(ratio: number | null | undefined): string {
  return ratio === null || ratio === undefined || !Number.isFinite(ratio) ? '—' : `${formatNumber(ratio, 2)}×`;
}

export function formatPh(ph: number | null | undefined): string {
  return ph === null || ph === undefined || !Number.isFinite(ph) ? '—' : ph.toFixed(2);
}

export function formatDate(iso: string | null | undefined): string {
  return iso ? new Date(iso).toLocaleDateString(undefined, { dateStyle: 'medium' }) : '—';
}

export function formatDateTime(iso: string | null | undefined): string {
  return iso ? new Date(iso).toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' }) : '—';
}
