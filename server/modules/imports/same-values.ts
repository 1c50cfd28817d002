// Relative difference below which two stored numbers are the same value: far below any measurement's
// precision, far above the rounding of one unit conversion.
const RELATIVE_TOLERANCE = 1e-9;

/**
 * Whether two stored numbers are the same value (both absent counts as the same).
 *
 * @param first one value, or null
 * @param second the other, or null
 * @returns true when equal within a relative 1e-9
 */
export function sameNumber(first: number | null | undefined, second: number | null | undefined): boolean {
  const a = first ?? null;
  const b = second ?? null;
  if (a === null || b === null) return a === b;
  if (a === b) return true;
  return Math.abs(a - b) <= RELATIVE_TOLERANCE * Math.max(Math.abs(a), Math.abs(b));
}

/**
 * Whether two stored texts are the same (null and empty alike).
 *
 * @param first one text, or null
 * @param second the other, or null
 * @returns true when equal
 */
export function sameText(first: string | null | undefined, second: string | null | undefined): boolean {
  return (first ?? '') === (second ?? '');
}

/**
 * The natural key of a temperature or pH in an assay key: rounded so that 37 °C read as 310.15 K and
 * written back compare equal.
 *
 * @param value the stored number
 * @returns the number rounded to 1e-6
 */
export function keyNumber(value: number): string {
  return (Math.round(value * 1e6) / 1e6).toString();
}
