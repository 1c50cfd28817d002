import { formatNumber, powerOfTen } from '@/lib/format';

/** Km and its error in one unit, the one that keeps Km between 1 and 1000 where it can (M in, text out). */
export function kmWithError(km: { value: number; se: number | null } | null): string {
  if (!km) return '—';
  const [factor, unit] = km.value >= 1e-3 ? [1e3, 'mM'] : km.value >= 1e-6 ? [1e6, 'µM'] : [1e9, 'nM'];
  return `${formatNumber(km.value * factor)}${km.se === null ? '' : ` ± ${formatNumber(km.se * factor, 2)}`} ${unit}`;
}

/**
 * A value with its standard error as the trade writes it: `0.849 ± 0.022`, or with a shared power of ten
 * outside 0.01–10,000 (always for kcat/Km), `(2.21 ± 0.13) × 10²`.
 */
export function withError(value: { value: number; se: number | null } | null, alwaysScientific = false): string {
  if (!value) return '—';
  const exponent = value.value === 0 ? 0 : Math.floor(Math.log10(Math.abs(value.value)));
  if (!alwaysScientific && exponent >= -2 && exponent <= 3) {
    // The error in plain decimals too, to two significant figures with their trailing zero (0.010, not 0.01).
    const se = value.se === null ? null : value.se >= 1 ? formatNumber(value.se, 2) : value.se.toPrecision(2);
    return se === null ? formatNumber(value.value) : `${formatNumber(value.value)} ± ${se}`;
  }
  const scale = 10 ** exponent;
  const power = exponent === 0 && !alwaysScientific ? '' : ` × ${powerOfTen(exponent)}`;
  const mantissa = (number: number) => (number / scale).toFixed(2).replace(/^-/, '−');
  return value.se === null ? `${mantissa(value.value)}${power}` : `(${mantissa(value.value)} ± ${mantissa(value.se)})${power}`;
}
