import { z } from 'zod';

/**
 * The largest and smallest sizes (absolute values) a number in a request may have. No kinetic quantity in any
 * unit taken here comes near either (kcat/Km tops out near 10¹⁰ M⁻¹ s⁻¹; concentrations go down to about
 * 10⁻¹⁵ M), and within them the derived values (ratios, products, squared errors) stay finite in doubles.
 */
export const numberMagnitude = { largest: 1e100, smallest: 1e-100 } as const;

/** True when a number is zero or between the smallest and largest sizes a request may use. */
export function withinMagnitude(value: number): boolean {
  const size = Math.abs(value);
  return size === 0 || (size >= numberMagnitude.smallest && size <= numberMagnitude.largest);
}

/**
 * A number as requests send it: finite (JSON has no NaN or Infinity, and zod 4's number refuses them too), and
 * zero or of a size between 10⁻¹⁰⁰ and 10¹⁰⁰, so that arithmetic on it cannot overflow to Infinity.
 */
export const finiteNumber = () =>
  z.number({ error: 'must be a finite number' }).refine(withinMagnitude, 'must be zero or between 10⁻¹⁰⁰ and 10¹⁰⁰ in size');
