/**
 * Base limb of a pH–rate profile, one ionization whose protonated form is active:
 * k = kmax/(1 + 10^(pH − pKa)), with its analytic Jacobian.
 *
 * Reference: Dixon, Biochem. J. 55 (1953) 161; Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed.
 * (2012).
 *
 * @param ph pH values
 * @param parameters [kmax (unit of k), pKa (pH units)]
 * @param values receives k at each pH; NaN where 10^(…) overflows (a rejected step for the solver)
 * @param jacobian receives [∂k/∂kmax, ∂k/∂pKa] per point (row-major), or null
 * @returns nothing; writes into `values` and `jacobian`
 * @example
 * const k = [0];
 * phBaseCurve([9], [2, 8], k, null); // k[0] = 2/(1 + 10) = 0.1818…
 */
export function phBaseCurve(
  ph: ArrayLike<number>,
  parameters: ArrayLike<number>,
  values: number[],
  jacobian: number[] | null,
): void {
  const kmax = parameters[0];
  const pKa = parameters[1];
  for (let i = 0; i < ph.length; i += 1) {
    // exp(ln 10·x) rather than 10 ** x, for speed (see phBellCurve).
    const baseTerm = Math.exp(Math.LN10 * (ph[i] - pKa));
    const denominator = 1 + baseTerm;
    values[i] = Number.isFinite(denominator) ? kmax / denominator : Number.NaN;
    if (jacobian !== null) {
      // ∂k/∂pKa = +kmax·ln10·10^(pH − pKa)/D²
      jacobian[2 * i] = 1 / denominator;
      jacobian[2 * i + 1] = (kmax * Math.LN10 * baseTerm) / denominator / denominator;
    }
  }
}
