/** Largest assay-temperature difference between matched measurements, K (equal to 0.5 °C). */
export const MATCH_TEMPERATURE_TOLERANCE_KELVIN = 0.5;

/** Largest assay-pH difference between matched measurements, pH units. */
export const MATCH_PH_TOLERANCE = 0.1;

/**
 * Floating-point slack on the tolerances, so that 37.0 and 37.5 °C (stored as 310.15 and 310.65 K, whose
 * difference rounds to 0.50000000000006) or pH 6.0 and 6.1 still count as "within" them.
 */
const ROUNDING_SLACK = 1e-9;

/** The conditions that decide whether two kinetic measurements may be compared. */
export type AssayConditions = {
  /** Substrate name as entered; compared trimmed and case-insensitively. */
  substrate: string;
  /** Assay temperature, K. */
  temperatureKelvin: number;
  /** Assay pH. */
  ph: number;
};

/**
 * The substrate name in the form used for matching: trimmed, inner runs of white space collapsed to one
 * space, lower-cased. "pNP-Acetate " and "pnp-acetate" are one substrate; "pNP acetate" is another (the
 * registry does not guess chemistry from names).
 *
 * @param substrate a substrate name as entered
 * @returns the key used for matching
 * @example
 * substrateKey('  4-Nitrophenyl  Acetate'); // '4-nitrophenyl acetate'
 */
export function substrateKey(substrate: string): string {
  return substrate.trim().replace(/\s+/g, ' ').toLowerCase();
}

/**
 * Whether two measurements were made under matched conditions: the same substrate (trimmed,
 * case-insensitive), assay temperatures within 0.5 K and pH within 0.1. Rate constants depend steeply on
 * temperature (roughly twofold per 10 K near room temperature) and on pH near a catalytic pKa, so a
 * variant–parent ratio is only read as an effect of the mutation when the conditions agree this closely.
 *
 * Reference: the product's comparison rule (DESIGN.md, "A comparison is made only against a parent
 * measured under matched conditions"); the temperature dependence is common practice (the Q10 ≈ 2 rule
 * of thumb, e.g. Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012), ch. 11).
 *
 * @param first conditions of one measurement (temperature in K)
 * @param second conditions of the other
 * @returns true when substrate, temperature and pH all match within the tolerances
 * @example
 * conditionsMatch(
 *   { substrate: 'pNPA', temperatureKelvin: 310.15, ph: 6.0 },
 *   { substrate: ' PNPA', temperatureKelvin: 310.55, ph: 6.05 },
 * ); // true
 */
export function conditionsMatch(first: AssayConditions, second: AssayConditions): boolean {
  return (
    // Identical spellings (the usual case) skip the normalisation, which a campaign-wide recompute runs often.
    (first.substrate === second.substrate || substrateKey(first.substrate) === substrateKey(second.substrate)) &&
    Math.abs(first.temperatureKelvin - second.temperatureKelvin) <= MATCH_TEMPERATURE_TOLERANCE_KELVIN + ROUNDING_SLACK &&
    Math.abs(first.ph - second.ph) <= MATCH_PH_TOLERANCE + ROUNDING_SLACK
  );
}
