import { fitStraightLine } from './fit-straight-line';

/**
 * Starting values for a Michaelis–Menten fit, from the data alone so that nobody types a guess.
 *
 * In order of preference: the Hanes–Woolf line S/v = Km/Vmax + S/Vmax (the linearisation that distorts
 * the error structure least); the Eadie–Hofstee line v = Vmax − Km·v/S; and last the largest rate with the
 * substrate concentration whose rate is nearest half of it. Only points with S > 0 and v > 0 enter the
 * lines. The least-squares fit then refines whichever applies.
 *
 * Reference: Hanes, Biochem. J. 26 (1932) 1406; Eadie, J. Biol. Chem. 146 (1942) 85; Hofstee, Science
 * 116 (1952) 329; Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012).
 *
 * @param substrate substrate concentrations S ≥ 0 (unit of Km)
 * @param rate initial rates v (unit of Vmax), same length
 * @throws never; validated data always yield a start
 * @returns [Vmax, Km] with Km > 0
 * @example
 * // Exact data from Vmax = 10, Km = 2: the Hanes–Woolf line is exact.
 * michaelisMentenInitialEstimate([1, 2, 4], [10 / 3, 5, 20 / 3]); // [10, 2]
 */
export function michaelisMentenInitialEstimate(substrate: number[], rate: number[]): [number, number] {
  const usableS: number[] = [];
  const usableV: number[] = [];
  for (let i = 0; i < substrate.length; i += 1) {
    if (substrate[i] > 0 && rate[i] > 0) {
      usableS.push(substrate[i]);
      usableV.push(rate[i]);
    }
  }

  // Hanes–Woolf: slope 1/Vmax, intercept Km/Vmax.
  const hanesWoolf = fitStraightLine(
    usableS,
    usableS.map((s, i) => s / usableV[i]),
  );
  if (hanesWoolf !== null && hanesWoolf.slope > 0 && hanesWoolf.intercept > 0) {
    return [1 / hanesWoolf.slope, hanesWoolf.intercept / hanesWoolf.slope];
  }

  // Eadie–Hofstee: intercept Vmax, slope −Km.
  const eadieHofstee = fitStraightLine(
    usableS.map((s, i) => usableV[i] / s),
    usableV,
  );
  if (eadieHofstee !== null && eadieHofstee.intercept > 0 && eadieHofstee.slope < 0) {
    return [eadieHofstee.intercept, -eadieHofstee.slope];
  }

  return largestRateEstimate(substrate, rate);
}

/** Vmax ≈ the rate of largest magnitude; Km ≈ the positive S whose rate is nearest half of it. */
function largestRateEstimate(substrate: number[], rate: number[]): [number, number] {
  let vmax = 0;
  for (let i = 0; i < rate.length; i += 1) {
    if (Math.abs(rate[i]) > Math.abs(vmax)) vmax = rate[i];
  }
  // Validated data have at least two distinct S ≥ 0, so some S is positive and Km ends up positive.
  let km = 0;
  let bestDistance = Number.POSITIVE_INFINITY;
  for (let i = 0; i < substrate.length; i += 1) {
    const distance = Math.abs(rate[i] - vmax / 2);
    if (substrate[i] > 0 && distance < bestDistance) {
      bestDistance = distance;
      km = substrate[i];
    }
  }
  return [vmax, km];
}
