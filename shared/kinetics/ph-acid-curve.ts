/**
 * Acid limb of a pH–rate profile, one ionization whose deprotonated form is active:
 * k = kmax/(1 + 10^(pKa − pH)), with its analytic Jacobian.
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
 * phAcidCurve([5], [2, 5], k, null); // k[0] = 1: half of kmax at pH = pKa
 */
export function phAcidCurve(
  ph: ArrayLike<number>,
  parameters: ArrayLike<number>,
  values: number[],
  jacobian: number[] | null,
): void {
  const kmax = parameters[0];
  const pKa = parameters[1];
  for (let i = 0; i < ph.length; i += 1) {
    // exp(ln 10·x) rather than 10 ** x, for speed (see phBellCurve).
    const acidTerm = Math.exp(Math.LN10 * (pKa - ph[i]));
    const denominator = 1 + acidTerm;
    values[i] = Number.isFinite(denominator) ? kmax / denominator : Number.NaN;
    if (jacobian !== null) {
      // ∂k/∂pKa = −kmax·ln10·10^(pKa − pH)/D²
      jacobian[2 * i] = 1 / denominator;
      jacobian[2 * i + 1] = (-kmax * Math.LN10 * acidTerm) / denominator / denominator;
    }
  }
}
