/**
 * Cholesky pivots of the unit-diagonal-scaled JᵀJ below this mean a condition number above about 10¹²,
 * where the inverse would keep fewer than four correct digits: the parameters are then reported as not
 * determined rather than with a standard error that is mostly rounding noise.
 */
export const SINGULAR_PIVOT_TOLERANCE = 1e-12;

/**
 * Asymptotic covariance matrix of least-squares parameter estimates, s²·(JᵀJ)⁻¹.
 *
 * JᵀJ is first scaled to unit diagonal (the inverse of a correlation-like matrix), so that parameters of
 * very different magnitude (NIST Misra1d: 437 beside 3·10⁻⁴) cost no accuracy, then inverted through its
 * Cholesky factor.
 *
 * Reference: Bates & Watts, Nonlinear Regression Analysis and Its Applications (1988), ch. 2; Golub &
 * Van Loan, Matrix Computations, 4th ed. (2013), §4.2.
 *
 * @param normalMatrix JᵀJ at the solution, p × p row-major (weighted if the fit was)
 * @param parameterCount p
 * @param residualVariance s² = RSS/(n − p), in the squared unit of the response
 * @throws never; a singular matrix is reported by the return value
 * @returns the p × p covariance (units: products of the parameters' units), or null when JᵀJ is
 *   numerically singular (a zero column or a pivot below {@link SINGULAR_PIVOT_TOLERANCE})
 * @example
 * parameterCovariance([4, 0, 0, 1], 2, 2); // [[0.5, 0], [0, 2]]
 */
export function parameterCovariance(
  normalMatrix: number[],
  parameterCount: number,
  residualVariance: number,
): number[][] | null {
  const p = parameterCount;
  const inverseRoot = new Array<number>(p).fill(0);
  for (let i = 0; i < p; i += 1) {
    const diagonal = normalMatrix[i * p + i];
    if (!(diagonal > 0)) return null;
    inverseRoot[i] = 1 / Math.sqrt(diagonal);
  }

  // Cholesky factor L of the scaled matrix Ŝ = D·JᵀJ·D, D = diag(1/√(JᵀJ)ᵢᵢ).
  const factor = new Array<number>(p * p).fill(0);
  for (let j = 0; j < p; j += 1) {
    let pivot = 1;
    for (let k = 0; k < j; k += 1) pivot -= factor[j * p + k] * factor[j * p + k];
    if (!(pivot > SINGULAR_PIVOT_TOLERANCE)) return null;
    const diagonal = Math.sqrt(pivot);
    factor[j * p + j] = diagonal;
    for (let i = j + 1; i < p; i += 1) {
      let sum = normalMatrix[i * p + j] * inverseRoot[i] * inverseRoot[j];
      for (let k = 0; k < j; k += 1) sum -= factor[i * p + k] * factor[j * p + k];
      factor[i * p + j] = sum / diagonal;
    }
  }

  // L⁻¹ by forward substitution, column by column.
  const inverseFactor = new Array<number>(p * p).fill(0);
  for (let column = 0; column < p; column += 1) {
    for (let i = column; i < p; i += 1) {
      let sum = i === column ? 1 : 0;
      for (let k = column; k < i; k += 1) sum -= factor[i * p + k] * inverseFactor[k * p + column];
      inverseFactor[i * p + column] = sum / factor[i * p + i];
    }
  }

  // (JᵀJ)⁻¹ = D·L⁻ᵀ·L⁻¹·D, times s².
  const covariance: number[][] = [];
  for (let i = 0; i < p; i += 1) covariance.push(new Array<number>(p).fill(0));
  for (let i = 0; i < p; i += 1) {
    for (let j = 0; j <= i; j += 1) {
      let sum = 0;
      for (let k = i; k < p; k += 1) sum += inverseFactor[k * p + i] * inverseFactor[k * p + j];
      const value = residualVariance * sum * inverseRoot[i] * inverseRoot[j];
      covariance[i][j] = value;
      covariance[j][i] = value;
    }
  }
  return covariance;
}
