/**
 * A nonlinear least-squares problem: minimise Σ rᵢ(θ)² over θ.
 *
 * `responseSumOfSquares` is Σ wᵢyᵢ², the scale against which an exact fit is recognised. `evaluate`
 * writes rᵢ = √wᵢ·(yᵢ − f(xᵢ; θ)) into `residuals` and the weighted model Jacobian √wᵢ·∂f(xᵢ; θ)/∂θⱼ
 * row-major (n × p) into `jacobian`, and returns Σ rᵢ²; it returns a non-finite number when θ is outside
 * the model's domain, which makes the solver reject the step. Residuals and Jacobian come from one call
 * because they share most of their work (the exponentials of a pH profile, say), and a trial step is
 * accepted more often than not.
 */
export type LeastSquaresProblem = {
  readonly pointCount: number;
  readonly parameterCount: number;
  readonly responseSumOfSquares: number;
  evaluate(parameters: number[], residuals: number[], jacobian: number[]): number;
};

/**
 * The solver's answer: parameters at the minimum, the weighted residuals there, their sum of squares,
 * JᵀJ at the minimum (p × p, row-major, for the covariance), the number of iterations and whether one
 * of the convergence tests was met.
 */
export type LevenbergMarquardtResult = {
  parameters: number[];
  residuals: number[];
  rss: number;
  normalMatrix: number[];
  iterations: number;
  converged: boolean;
};

/** Iterations (trial steps, accepted or not) before the solver gives up and reports non-convergence. */
export const MAX_ITERATIONS = 200;
/** Starting damping λ relative to diag(JᵀJ) (Marquardt's suggestion). */
const INITIAL_DAMPING = 1e-3;
/** Converged when the scaled step ‖Dδ‖ is this small relative to ‖Dθ‖ (MINPACK's xtol test, but tighter). */
const STEP_TOLERANCE = 1e-11;
/** Converged when every column of J is this close to orthogonal to r (MINPACK's gtol test, cosine). */
const GRADIENT_TOLERANCE = 1e-13;
/**
 * When the damping has grown until the step vanishes without lowering the RSS, θ is a minimum to working
 * precision only if J and r are nearly orthogonal; otherwise the solver is stuck (for example at the edge of
 * the model's domain) and says so.
 */
const STALLED_GRADIENT_TOLERANCE = 1e-6;
/** An RSS change this small relative to the RSS is rounding noise (a sum of squares carries ~n ulps of error). */
const ROUNDING_RSS_CHANGE = 1e-14;
/** Rounding-level steps that shrink by less than this factor from one iteration to the next are noise. */
const NOISE_STEP_CONTRACTION = 0.5;
/** A residual norm this small relative to the weighted data norm is an exact fit. */
const EXACT_FIT_TOLERANCE = 1e-13;
/** The damping is capped so that λ·D never swamps JᵀJ to the point of overflow. */
const MAX_DAMPING = 1e32;

/**
 * Levenberg–Marquardt nonlinear least squares with an analytic Jacobian.
 *
 * Marquardt's scaled form: each step solves (JᵀJ + λ·D)·δ = Jᵀr by Cholesky, with D the running maximum
 * of diag(JᵀJ) (Moré 1978), so the iteration does not depend on the units of the parameters (Vmax in the
 * hundreds beside Km⁻¹ in the 10⁻⁴ is NIST Misra1d's point). λ follows Nielsen's gain-ratio rule. The
 * normal equations are acceptable here because only the step comes from them: the minimum itself is where
 * Jᵀr = 0, which is evaluated directly, and the covariance is inverted after unit-diagonal scaling.
 *
 * It stops when the scaled step is below 10⁻¹¹ of the parameters, when r is orthogonal to J's columns to
 * 10⁻¹³, or when steps that the RSS can no longer resolve (changes at rounding level) stop shrinking.
 * The last rule matters: near the minimum the RSS is flat to rounding while the Gauss–Newton step is still
 * accurate, so refusing such steps would cost several iterations and leave digits on the table. On the
 * 200 Michaelis–Menten test sets the answers lie within 2·10⁻¹⁰ (relative; median 10⁻¹²) of a 40-digit
 * solution of Jᵀr = 0.
 *
 * Why not a package such as ml-levenberg-marquardt: it differentiates by finite differences, which limits
 * the answer to about 7 significant digits; the engine needs ≥ 8 on NIST StRD and its fits must take a few
 * microseconds, so the problem supplies its Jacobian analytically and the solver works in buffers allocated
 * once per fit. (Plain arrays, not Float64Array: in Node each typed-array allocation costs about a
 * microsecond, as much as a whole iteration of a 12-point fit.)
 *
 * References: Marquardt, J. Soc. Ind. Appl. Math. 11 (1963) 431; Moré, "The Levenberg–Marquardt algorithm:
 * implementation and theory", Lecture Notes in Mathematics 630 (1978) 105; Madsen, Nielsen & Tingleff,
 * "Methods for non-linear least squares problems", 2nd ed., DTU (2004), §3.2.
 *
 * @param problem the residual and Jacobian functions (see {@link LeastSquaresProblem})
 * @param start starting parameters, inside the model's domain (units of the model's parameters)
 * @throws {RangeError} when `start` has the wrong length or gives a non-finite RSS (a programming error
 *   in the caller's starting values, not bad user input)
 * @returns the parameters at the minimum with residuals, RSS, JᵀJ, iteration count and convergence flag
 * @example
 * // Fit y = a·x through (1, 2) and (2, 4): a = 2 exactly.
 * const x = [1, 2], y = [2, 4];
 * levenbergMarquardt({
 *   pointCount: 2, parameterCount: 1, responseSumOfSquares: 20,
 *   evaluate(p, r, j) {
 *     r[0] = y[0] - p[0] * x[0]; r[1] = y[1] - p[0] * x[1]; j[0] = x[0]; j[1] = x[1];
 *     return r[0] ** 2 + r[1] ** 2;
 *   },
 * }, [1]).parameters[0]; // 2
 */
export function levenbergMarquardt(
  problem: LeastSquaresProblem,
  start: readonly number[],
): LevenbergMarquardtResult {
  const n = problem.pointCount;
  const p = problem.parameterCount;
  if (start.length !== p) {
    throw new RangeError(`levenbergMarquardt requires ${p} starting values`);
  }

  let parameters = start.slice();
  let trialParameters = new Array<number>(p).fill(0);
  let residuals = new Array<number>(n).fill(0);
  let trialResiduals = new Array<number>(n).fill(0);
  let jacobian = new Array<number>(n * p).fill(0);
  let trialJacobian = new Array<number>(n * p).fill(0);
  const normalMatrix = new Array<number>(p * p).fill(0);
  const gradient = new Array<number>(p).fill(0);
  const scale = new Array<number>(p).fill(0);
  const system = new Array<number>(p * p).fill(0);
  const step = new Array<number>(p).fill(0);

  let rss = problem.evaluate(parameters, residuals, jacobian);
  if (!Number.isFinite(rss)) {
    throw new RangeError('levenbergMarquardt requires starting values inside the model domain');
  }
  const exactFitRss = problem.responseSumOfSquares * EXACT_FIT_TOLERANCE * EXACT_FIT_TOLERANCE;

  formNormalEquations(jacobian, residuals, n, p, normalMatrix, gradient);
  updateScale(normalMatrix, p, scale);

  let damping = INITIAL_DAMPING;
  let dampingGrowth = 2;
  let converged = false;
  let iterations = 0;
  let previousRelativeStep = Number.POSITIVE_INFINITY;

  while (iterations < MAX_ITERATIONS) {
    if (rss <= exactFitRss || orthogonality(normalMatrix, gradient, rss, p) <= GRADIENT_TOLERANCE) {
      converged = true;
      break;
    }
    iterations += 1;

    // Damped normal equations (JᵀJ + λD)δ = Jᵀr.
    for (let i = 0; i < p * p; i += 1) system[i] = normalMatrix[i];
    for (let i = 0; i < p; i += 1) system[i * p + i] += damping * scale[i];
    if (!choleskySolve(system, gradient, p, step)) {
      damping = Math.min(damping * dampingGrowth, MAX_DAMPING);
      dampingGrowth *= 2;
      continue;
    }

    let stepNorm = 0;
    let parameterNorm = 0;
    let predictedReduction = 0;
    for (let i = 0; i < p; i += 1) {
      trialParameters[i] = parameters[i] + step[i];
      stepNorm += scale[i] * step[i] * step[i];
      parameterNorm += scale[i] * parameters[i] * parameters[i];
      // Reduction predicted by the linear model: δᵀ(Jᵀr + λDδ).
      predictedReduction += step[i] * (gradient[i] + damping * scale[i] * step[i]);
    }
    const stepIsNegligible = Math.sqrt(stepNorm) <= STEP_TOLERANCE * (Math.sqrt(parameterNorm) + STEP_TOLERANCE);

    const trialRss = problem.evaluate(trialParameters, trialResiduals, trialJacobian);
    // Near the minimum the RSS stops resolving steps (it is flat to second order) while the step, computed
    // from the gradient, stays accurate: a step whose predicted and actual RSS changes are both at rounding
    // level is taken. Once such steps stop shrinking they are rounding noise themselves, and θ is final.
    const relativeStep = Math.sqrt(stepNorm / parameterNorm);
    const atRoundingLevel =
      predictedReduction <= ROUNDING_RSS_CHANGE * rss && trialRss <= rss * (1 + ROUNDING_RSS_CHANGE);
    const atNoiseFloor = atRoundingLevel && relativeStep > NOISE_STEP_CONTRACTION * previousRelativeStep;
    previousRelativeStep = relativeStep;
    if (Number.isFinite(trialRss) && (trialRss < rss || atRoundingLevel)) {
      // Accept: swap buffers rather than copy.
      const gainRatio = (rss - trialRss) / predictedReduction;
      const previousParameters = parameters;
      parameters = trialParameters;
      trialParameters = previousParameters;
      const previousResiduals = residuals;
      residuals = trialResiduals;
      trialResiduals = previousResiduals;
      const previousJacobian = jacobian;
      jacobian = trialJacobian;
      trialJacobian = previousJacobian;
      rss = trialRss;
      formNormalEquations(jacobian, residuals, n, p, normalMatrix, gradient);
      updateScale(normalMatrix, p, scale);
      // Nielsen's update: shrink λ by up to 3× when the linear model predicted the reduction well.
      const centred = 2 * gainRatio - 1;
      damping *= Math.max(1 / 3, 1 - centred * centred * centred);
      dampingGrowth = 2;
      if (stepIsNegligible || atNoiseFloor) {
        converged = true;
        break;
      }
    } else {
      if (stepIsNegligible) {
        converged = orthogonality(normalMatrix, gradient, rss, p) <= STALLED_GRADIENT_TOLERANCE;
        break;
      }
      damping = Math.min(damping * dampingGrowth, MAX_DAMPING);
      dampingGrowth *= 2;
    }
  }

  return { parameters, residuals, rss, normalMatrix, iterations, converged };
}

/** JᵀJ and Jᵀr from the row-major Jacobian, as column dot products (simple inner loops V8 compiles well). */
function formNormalEquations(
  jacobian: number[],
  residuals: number[],
  n: number,
  p: number,
  normalMatrix: number[],
  gradient: number[],
): void {
  for (let i = 0; i < p; i += 1) {
    let gradientSum = 0;
    for (let row = 0; row < n; row += 1) gradientSum += jacobian[row * p + i] * residuals[row];
    gradient[i] = gradientSum;
    for (let j = 0; j <= i; j += 1) {
      let sum = 0;
      for (let row = 0; row < n; row += 1) sum += jacobian[row * p + i] * jacobian[row * p + j];
      normalMatrix[i * p + j] = sum;
      normalMatrix[j * p + i] = sum;
    }
  }
}

/** D = running maximum of diag(JᵀJ); a column with no influence gets 1 so that the damped system stays regular. */
function updateScale(normalMatrix: number[], p: number, scale: number[]): void {
  for (let i = 0; i < p; i += 1) {
    const diagonal = normalMatrix[i * p + i];
    scale[i] = Math.max(scale[i], diagonal > 0 ? diagonal : 1);
  }
}

/** max over columns of |Jⱼᵀr| / (‖Jⱼ‖·‖r‖): the cosine that is 0 exactly at a stationary point. */
function orthogonality(normalMatrix: number[], gradient: number[], rss: number, p: number): number {
  const residualNorm = Math.sqrt(rss);
  let largest = 0;
  for (let i = 0; i < p; i += 1) {
    const columnNorm = Math.sqrt(normalMatrix[i * p + i]);
    if (columnNorm > 0) largest = Math.max(largest, Math.abs(gradient[i]) / (columnNorm * residualNorm));
  }
  return largest;
}

/** Solves A·x = b for symmetric positive-definite A (destroyed); false when A is not numerically positive definite. */
function choleskySolve(matrix: number[], rhs: number[], p: number, solution: number[]): boolean {
  // Factor A = L·Lᵀ in the lower triangle.
  for (let j = 0; j < p; j += 1) {
    let pivot = matrix[j * p + j];
    for (let k = 0; k < j; k += 1) pivot -= matrix[j * p + k] * matrix[j * p + k];
    if (!(pivot > 0)) return false;
    const diagonal = Math.sqrt(pivot);
    matrix[j * p + j] = diagonal;
    for (let i = j + 1; i < p; i += 1) {
      let sum = matrix[i * p + j];
      for (let k = 0; k < j; k += 1) sum -= matrix[i * p + k] * matrix[j * p + k];
      matrix[i * p + j] = sum / diagonal;
    }
  }
  // Forward substitution L·y = b, then back substitution Lᵀ·x = y.
  for (let i = 0; i < p; i += 1) {
    let sum = rhs[i];
    for (let k = 0; k < i; k += 1) sum -= matrix[i * p + k] * solution[k];
    solution[i] = sum / matrix[i * p + i];
  }
  for (let i = p - 1; i >= 0; i -= 1) {
    let sum = solution[i];
    for (let k = i + 1; k < p; k += 1) sum -= matrix[k * p + i] * solution[k];
    solution[i] = sum / matrix[i * p + i];
  }
  return true;
}
