/**
 * Ordinary least-squares straight line y = intercept + slope·x, the closed form through the centred sums
 * (which avoids the cancellation of the textbook Σxy − n·x̄ȳ form).
 *
 * Reference: Draper & Smith, Applied Regression Analysis, 3rd ed. (1998), §1.2.
 *
 * @param x abscissae (any unit)
 * @param y ordinates (any unit), same length as x
 * @throws never; too little data is reported by the return value
 * @returns slope (unit of y per unit of x) and intercept (unit of y), or null when fewer than two
 *   distinct x values are given
 * @example
 * fitStraightLine([0, 1, 2], [1, 3, 5]); // { slope: 2, intercept: 1 }
 */
export function fitStraightLine(
  x: readonly number[],
  y: readonly number[],
): { slope: number; intercept: number } | null {
  const n = x.length;
  if (n < 2) return null;
  let meanX = 0;
  let meanY = 0;
  for (let i = 0; i < n; i += 1) {
    meanX += x[i];
    meanY += y[i];
  }
  meanX /= n;
  meanY /= n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i += 1) {
    const dx = x[i] - meanX;
    sxx += dx * dx;
    sxy += dx * (y[i] - meanY);
  }
  if (!(sxx > 0)) return null;
  const slope = sxy / sxx;
  return { slope, intercept: meanY - slope * meanX };
}
