/**
 * Substrate-inhibition (Haldane) rate law v = Vmax·S/(Km + S + S²/Ki), written with u = 1/Ki as
 * v = Vmax·S/(Km + S + u·S²), with its analytic Jacobian.
 *
 * The fit works in u because "no inhibition" is then the ordinary point u = 0 instead of Ki → ∞, where
 * the solver would wander; the covariance is mapped back to Ki exactly (a reparametrisation changes the
 * linearised covariance by its Jacobian only).
 *
 * Reference: Haldane, Enzymes (1930); Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012).
 *
 * @param substrate substrate concentrations S (any concentration unit)
 * @param parameters [Vmax (unit of v), Km (unit of S), u = 1/Ki (reciprocal unit of S)]
 * @param values receives v at each S
 * @param jacobian receives [∂v/∂Vmax, ∂v/∂Km, ∂v/∂u] per point (row-major), or null when not needed
 * @returns nothing; writes into `values` and `jacobian`
 * @example
 * const v = [0];
 * substrateInhibitionCurve([2], [10, 2, 0.5], v, null); // v[0] = 10·2/(2 + 2 + 2) = 3.333…
 */
export function substrateInhibitionCurve(
  substrate: ArrayLike<number>,
  parameters: ArrayLike<number>,
  values: number[],
  jacobian: number[] | null,
): void {
  const vmax = parameters[0];
  const km = parameters[1];
  const inverseKi = parameters[2];
  for (let i = 0; i < substrate.length; i += 1) {
    const s = substrate[i];
    const denominator = km + s + inverseKi * s * s;
    const fraction = s / denominator;
    values[i] = vmax * fraction;
    if (jacobian !== null) {
      // ∂v/∂Km = −Vmax·S/D², ∂v/∂u = −Vmax·S³/D²
      const common = (-vmax * fraction) / denominator;
      jacobian[3 * i] = fraction;
      jacobian[3 * i + 1] = common;
      jacobian[3 * i + 2] = common * s * s;
    }
  }
}
