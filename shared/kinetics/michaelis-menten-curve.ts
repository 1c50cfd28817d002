/**
 * Michaelis–Menten rate law v = Vmax·S/(Km + S), with its analytic Jacobian.
 *
 * Reference: Michaelis & Menten, Biochem. Z. 49 (1913) 333; Briggs & Haldane, Biochem. J. 19 (1925) 338.
 *
 * @param substrate substrate concentrations S (any concentration unit, the unit of Km)
 * @param parameters [Vmax (unit of v), Km (unit of S)]
 * @param values receives v at each S
 * @param jacobian receives [∂v/∂Vmax, ∂v/∂Km] per point (row-major), or null when not needed
 * @returns nothing; writes into `values` and `jacobian`
 * @example
 * const v = [0];
 * michaelisMentenCurve([2], [10, 2], v, null); // v[0] = 5: half of Vmax at S = Km
 */
export function michaelisMentenCurve(
  substrate: ArrayLike<number>,
  parameters: ArrayLike<number>,
  values: number[],
  jacobian: number[] | null,
): void {
  const vmax = parameters[0];
  const km = parameters[1];
  for (let i = 0; i < substrate.length; i += 1) {
    const s = substrate[i];
    const denominator = km + s;
    const saturation = s / denominator;
    values[i] = vmax * saturation;
    if (jacobian !== null) {
      jacobian[2 * i] = saturation;
      // ∂v/∂Km = −Vmax·S/(Km + S)²
      jacobian[2 * i + 1] = (-vmax * saturation) / denominator;
    }
  }
}
