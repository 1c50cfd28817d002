import { fitStraightLine } from './fit-straight-line';
import { michaelisMentenInitialEstimate } from './michaelis-menten-initial-estimate';

/** The plateau is started a little above the largest rate, so every rate lies below it on the Hill plot. */
const PLATEAU_MARGIN = 1.05;

/**
 * Starting values for a Hill fit, from the data alone.
 *
 * Vmax starts at 1.05 × the largest rate; the Hill plot ln(v/(Vmax − v)) = n·ln S − n·ln K½ through
 * the points with S > 0 and 0 < v < Vmax then gives n (its slope) and K½. When the plot is unusable (fewer
 * than two such points, or a slope that is not positive) the start is the Michaelis–Menten estimate with
 * n = 1.
 *
 * Reference: Hill, J. Physiol. 40 (1910) iv; Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed.
 * (2012) (the Hill plot).
 *
 * @param substrate substrate concentrations S ≥ 0 (unit of K½)
 * @param rate initial rates v (unit of Vmax), same length
 * @throws never; validated data always yield a start
 * @returns [Vmax, K½, n] with K½ > 0 and n > 0
 * @example
 * // Exact data from Vmax = 10, K½ = 2, n = 2 at S = 1, 2, 4 (v = 2, 5, 8): the plateau starts at 8.4, and
 * // the Hill plot of ln(v/(8.4 − v)) against ln S has slope 3.0; the fit then refines all three.
 * hillInitialEstimate([1, 2, 4], [2, 5, 8]); // [8.4, 1.563…, 3.000…]
 */
export function hillInitialEstimate(substrate: number[], rate: number[]): [number, number, number] {
  const [mmVmax, mmKm] = michaelisMentenInitialEstimate(substrate, rate);
  let largestRate = 0;
  for (let i = 0; i < rate.length; i += 1) largestRate = Math.max(largestRate, rate[i]);
  if (!(largestRate > 0)) return [mmVmax, mmKm, 1];

  const plateau = PLATEAU_MARGIN * largestRate;
  const logS: number[] = [];
  const logit: number[] = [];
  for (let i = 0; i < substrate.length; i += 1) {
    if (substrate[i] > 0 && rate[i] > 0) {
      logS.push(Math.log(substrate[i]));
      logit.push(Math.log(rate[i] / (plateau - rate[i])));
    }
  }
  const line = fitStraightLine(logS, logit);
  if (line === null || !(line.slope > 0)) return [plateau, mmKm, 1];
  // Intercept = −n·ln K½.
  return [plateau, Math.exp(-line.intercept / line.slope), line.slope];
}
