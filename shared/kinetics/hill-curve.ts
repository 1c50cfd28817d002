/**
 * Hill equation v = Vmax·Sⁿ/(K½ⁿ + Sⁿ), with its analytic Jacobian.
 *
 * Evaluated as Vmax·h with h = 1/(1 + q), q = (K½/S)ⁿ, and the derivatives through h·(1 − h); h and
 * 1 − h are each formed from whichever of q and 1/q is at most 1, so neither loses digits by
 * cancellation and a huge q gives h = 0 instead of ∞/∞. The model is defined for K½ > 0 and n > 0 only;
 * outside that it returns NaN, which the solver treats as a rejected step.
 *
 * Reference: Hill, J. Physiol. 40 (1910) iv; Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed.
 * (2012).
 *
 * @param substrate substrate concentrations S ≥ 0 (any concentration unit)
 * @param parameters [Vmax (unit of v), K½ (unit of S), n (dimensionless)]
 * @param values receives v at each S
 * @param jacobian receives [∂v/∂Vmax, ∂v/∂K½, ∂v/∂n] per point (row-major), or null when not needed
 * @returns nothing; writes into `values` and `jacobian`
 * @example
 * const v = [0];
 * hillCurve([1], [10, 2, 2], v, null); // v[0] = 10·1/(4 + 1) = 2
 */
export function hillCurve(
  substrate: ArrayLike<number>,
  parameters: ArrayLike<number>,
  values: number[],
  jacobian: number[] | null,
): void {
  const vmax = parameters[0];
  const khalf = parameters[1];
  const hill = parameters[2];
  const insideDomain = khalf > 0 && hill > 0;
  for (let i = 0; i < substrate.length; i += 1) {
    const s = substrate[i];
    if (!insideDomain) {
      values[i] = Number.NaN;
      continue;
    }
    if (s === 0) {
      // Sⁿ = 0 for n > 0: no rate and no sensitivity to any parameter.
      values[i] = 0;
      if (jacobian !== null) jacobian.fill(0, 3 * i, 3 * i + 3);
      continue;
    }
    const logRatio = Math.log(khalf / s);
    const powerRatio = Math.exp(hill * logRatio);
    let saturation: number;
    let complement: number;
    if (powerRatio <= 1) {
      saturation = 1 / (1 + powerRatio);
      complement = powerRatio * saturation;
    } else {
      complement = 1 / (1 + 1 / powerRatio);
      saturation = complement / powerRatio;
    }
    values[i] = vmax * saturation;
    if (jacobian !== null) {
      // ∂h/∂K½ = −n·h(1 − h)/K½, ∂h/∂n = −h(1 − h)·ln(K½/S)
      const slope = vmax * saturation * complement;
      jacobian[3 * i] = saturation;
      jacobian[3 * i + 1] = (-slope * hill) / khalf;
      jacobian[3 * i + 2] = -slope * logRatio;
    }
  }
}
