import { michaelisMentenInitialEstimate } from './michaelis-menten-initial-estimate';

/**
 * Starting values for a substrate-inhibition fit, from the data alone.
 *
 * The rate law linearises exactly as S/v = Km/Vmax + S/Vmax + S²/(Vmax·Ki), a parabola in S (the
 * Hanes–Woolf line with a quadratic term), so a least-squares parabola through the points with S > 0 and
 * v > 0 gives all three parameters. When the parabola is unusable (a non-positive S coefficient) the start
 * is the Michaelis–Menten estimate with no inhibition, 1/Ki = 0; a negative 1/Ki is also replaced by 0.
 *
 * Reference: Cornish-Bowden, Fundamentals of Enzyme Kinetics, 4th ed. (2012) (linear forms of the rate laws).
 *
 * @param substrate substrate concentrations S ≥ 0 (unit of Km and Ki)
 * @param rate initial rates v (unit of Vmax), same length
 * @throws never; validated data always yield a start
 * @returns [Vmax, Km, 1/Ki] with Km > 0 and 1/Ki ≥ 0
 * @example
 * // Exact data from Vmax = 10, Km = 1, Ki = 4 (1/Ki = 0.25).
 * const s = [0.5, 1, 2, 4, 8];
 * substrateInhibitionInitialEstimate(s, s.map((x) => (10 * x) / (1 + x + (x * x) / 4))); // [10, 1, 0.25]
 */
export function substrateInhibitionInitialEstimate(
  substrate: number[],
  rate: number[],
): [number, number, number] {
  const [mmVmax, mmKm] = michaelisMentenInitialEstimate(substrate, rate);
  const parabola = fitParabola(substrate, rate);
  if (parabola === null || !(parabola[1] > 0)) return [mmVmax, mmKm, 0];
  const [constant, linear, quadratic] = parabola;
  const vmax = 1 / linear;
  const km = constant > 0 ? constant * vmax : mmKm;
  return [vmax, km, Math.max(quadratic * vmax, 0)];
}

/** Least-squares S/v = c₀ + c₁S + c₂S² over points with S > 0, v > 0; null with fewer than three such S. */
function fitParabola(substrate: number[], rate: number[]): [number, number, number] | null {
  let largestS = 0;
  for (let i = 0; i < substrate.length; i += 1) {
    if (substrate[i] > 0 && rate[i] > 0) largestS = Math.max(largestS, substrate[i]);
  }
  if (largestS === 0) return null;

  // Normal equations in t = S/max S, which keeps the 3 × 3 system well scaled whatever the unit of S.
  const moments = new Array<number>(5).fill(0);
  const rhs = new Array<number>(3).fill(0);
  for (let i = 0; i < substrate.length; i += 1) {
    if (!(substrate[i] > 0 && rate[i] > 0)) continue;
    const t = substrate[i] / largestS;
    const y = substrate[i] / rate[i];
    let power = 1;
    for (let k = 0; k < 5; k += 1) {
      moments[k] += power;
      if (k < 3) rhs[k] += power * y;
      power *= t;
    }
  }
  const system = [
    [moments[0], moments[1], moments[2], rhs[0]],
    [moments[1], moments[2], moments[3], rhs[1]],
    [moments[2], moments[3], moments[4], rhs[2]],
  ];
  // Gaussian elimination with partial pivoting.
  for (let column = 0; column < 3; column += 1) {
    let pivotRow = column;
    for (let row = column + 1; row < 3; row += 1) {
      if (Math.abs(system[row][column]) > Math.abs(system[pivotRow][column])) pivotRow = row;
    }
    [system[column], system[pivotRow]] = [system[pivotRow], system[column]];
    const pivot = system[column][column];
    // Fewer than three distinct usable S make the system singular.
    if (Math.abs(pivot) <= 1e-12 * moments[0]) return null;
    for (let row = column + 1; row < 3; row += 1) {
      const factor = system[row][column] / pivot;
      for (let k = column; k < 4; k += 1) system[row][k] -= factor * system[column][k];
    }
  }
  const coefficients = [0, 0, 0];
  for (let row = 2; row >= 0; row -= 1) {
    let sum = system[row][3];
    for (let k = row + 1; k < 3; k += 1) sum -= system[row][k] * coefficients[k];
    coefficients[row] = sum / system[row][row];
  }
  return [coefficients[0], coefficients[1] / largestS, coefficients[2] / (largestS * largestS)];
}
