/**
 * Numbers in a digest, written as the trade writes them and as the client's tables show them: the minus
 * sign U+2212, ΔΔG‡ to two decimals with its standard error, fold changes to two significant figures,
 * kcat/Km in scientific notation.
 */

const superscripts: Record<string, string> = { '-': '⁻', '0': '⁰', '1': '¹', '2': '²', '3': '³', '4': '⁴', '5': '⁵', '6': '⁶', '7': '⁷', '8': '⁸', '9': '⁹' };

const minus = (text: string) => text.replace(/^-/, '−');

function power(exponent: string): string {
  return Number(exponent)
    .toString()
    .split('')
    .map((character) => superscripts[character] ?? character)
    .join('');
}

/**
 * `value` to `digits` significant figures, in scientific notation outside 0.01–10,000.
 *
 * @param value a finite number
 * @param digits significant figures
 * @returns e.g. `2.6` or `3.0 × 10⁴`
 */
export function formatNumber(value: number, digits = 3): string {
  if (!Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const magnitude = Math.abs(value);
  if (magnitude >= 0.01 && magnitude < 10_000) return minus(Number(value.toPrecision(digits)).toString());
  const [mantissa, exponent] = value.toExponential(digits - 1).split('e');
  return `${minus(mantissa)} × 10${power(exponent)}`;
}

/**
 * ΔΔG‡ with its standard error.
 *
 * @param value kJ/mol
 * @param se kJ/mol
 * @returns e.g. `−2.83 ± 0.18`
 */
export function formatEnergy(value: number, se: number): string {
  return `${minus(value.toFixed(2))} ± ${se.toFixed(2)}`;
}

/**
 * A fold change relative to the parent.
 *
 * @param ratio variant over parent
 * @returns e.g. `3×`, `0.52×`
 */
export function formatFoldChange(ratio: number): string {
  return `${formatNumber(ratio, 2)}×`;
}

/**
 * A specificity constant.
 *
 * @param perMolarPerSecond kcat/Km, M⁻¹ s⁻¹
 * @returns e.g. `3.00 × 10⁴ M⁻¹ s⁻¹`
 */
export function formatKcatOverKm(perMolarPerSecond: number): string {
  const [mantissa, exponent] = perMolarPerSecond.toExponential(2).split('e');
  return `${minus(mantissa)} × 10${power(exponent)} M⁻¹ s⁻¹`;
}

/**
 * Review states with their counts.
 *
 * @param counts e.g. { approved: 2, submitted: 1 }
 * @returns e.g. `2 approved, 1 submitted`
 */
export function formatReviewCounts(counts: Partial<Record<string, number>>): string {
  return Object.entries(counts)
    .filter(([, count]) => (count ?? 0) > 0)
    .map(([state, count]) => `${count} ${state}`)
    .join(', ');
}
