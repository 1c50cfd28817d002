import { formatNumber, powerOfTen } from '@/lib/format';

/**
 * Estimates with their standard errors, both in the unit that suits the value (the error in the same
 * unit, so `2.10 ± 0.15 mM`, never a value in mM with an error in µM).
 */

const kmUnits = [
  { unit: 'mM', perMolar: 1e3, from: 1e-3 },
  { unit: 'µM', perMolar: 1e6, from: 1e-6 },
  { unit: 'nM', perMolar: 1e9, from: 0 },
] as const;

// The value is rounded to the last digit of its error, and the error kept to two significant figures
// (common practice in reporting measured values, e.g. 0.934 ± 0.0071 → 0.9342 ± 0.0071).
const SE_SIGNIFICANT_FIGURES = 2;

function roundedPair(value: number, se: number): { value: string; se: string } {
  const decimals = Math.max(0, SE_SIGNIFICANT_FIGURES - 1 - Math.floor(Math.log10(se)));
  return { value: value.toFixed(decimals), se: se.toFixed(decimals) };
}

function withSe(value: number, se: number | null | undefined, unit: string): string {
  const suffix = unit ? ` ${unit}` : '';
  const hasSe = se !== null && se !== undefined && Number.isFinite(se) && se > 0;
  const magnitude = Math.abs(value);
  // Outside 0.01–10,000 the value and its error share one power of ten, so they read as one number.
  if (value !== 0 && (magnitude < 0.01 || magnitude >= 10_000)) {
    const exponent = Math.floor(Math.log10(magnitude));
    const scale = 10 ** exponent;
    const power = powerOfTen(exponent);
    if (!hasSe) return `${(value / scale).toPrecision(3)} × ${power}${suffix}`;
    const pair = roundedPair(value / scale, se / scale);
    return `(${pair.value} ± ${pair.se}) × ${power}${suffix}`;
  }
  if (!hasSe) return `${formatNumber(value)}${suffix}`;
  const pair = roundedPair(value, se);
  return `${pair.value} ± ${pair.se}${suffix}`;
}

/** kcat ± SE in s⁻¹; `withUnit: false` for a table column that names the unit in its heading. */
export function formatKcatWithSe(estimate: { value: number; se?: number | null } | null | undefined, withUnit = true): string {
  return estimate ? withSe(estimate.value, estimate.se, withUnit ? 's⁻¹' : '') : '—';
}

export type KmUnit = (typeof kmUnits)[number]['unit'];

/**
 * The unit that keeps the median of some Km values between 1 and 1000, so a table column of Km is in one
 * unit (mM when there is nothing to go by).
 */
export function kmUnitFor(valuesMolar: readonly (number | null | undefined)[]): KmUnit {
  const finite = valuesMolar.filter((value): value is number => value !== null && value !== undefined && Number.isFinite(value) && value > 0).sort((a, b) => a - b);
  if (finite.length === 0) return 'mM';
  const median = finite[Math.floor(finite.length / 2)];
  return (kmUnits.find((candidate) => median >= candidate.from) ?? kmUnits[kmUnits.length - 1]).unit;
}

/**
 * Km ± SE in the unit that suits the value, or in `unit` when given; `withUnit: false` leaves the unit to
 * the column heading.
 */
export function formatKmWithSe(estimate: { value: number; se?: number | null } | null | undefined, unit?: KmUnit, withUnit = true): string {
  if (!estimate || !Number.isFinite(estimate.value)) return '—';
  const scale = kmUnits.find((candidate) => (unit === undefined ? estimate.value >= candidate.from : candidate.unit === unit)) ?? kmUnits[kmUnits.length - 1];
  const se = estimate.se === null || estimate.se === undefined ? null : estimate.se * scale.perMolar;
  return withSe(estimate.value * scale.perMolar, se, withUnit ? scale.unit : '');
}

/** kcat/Km always in scientific notation with a shared power of ten: `(1.11 ± 0.03) × 10³ M⁻¹ s⁻¹`. */
export function formatKcatOverKmWithSe(estimate: { value: number; se?: number | null } | null | undefined, withUnit = true): string {
  if (!estimate || !Number.isFinite(estimate.value) || estimate.value <= 0) return '—';
  const exponent = Math.floor(Math.log10(estimate.value));
  const scale = 10 ** exponent;
  const power = powerOfTen(exponent);
  const se = estimate.se;
  const unit = withUnit ? ' M⁻¹ s⁻¹' : '';
  if (se === null || se === undefined || !Number.isFinite(se) || se <= 0) return `${(estimate.value / scale).toFixed(2)} × ${power}${unit}`;
  const pair = roundedPair(estimate.value / scale, se / scale);
  return `(${pair.value} ± ${pair.se}) × ${power}${unit}`;
}

/** A dimensionless ratio with its standard error, e.g. `3.01 ± 0.15`. */
export function formatRatioWithSe(ratio: { value: number; se: number } | null | undefined): string {
  if (!ratio || !Number.isFinite(ratio.value)) return '—';
  return withSe(ratio.value, ratio.se, '');
}
