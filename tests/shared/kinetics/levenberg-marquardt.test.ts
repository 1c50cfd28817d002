import { describe, expect, it } from 'vitest';
import { levenbergMarquardt, MAX_ITERATIONS, type LeastSquaresProblem } from '../../../shared/kinetics/levenberg-marquardt';

describe('levenbergMarquardt', () => {
  it('solves a linear least-squares problem exactly: y = a + b·x through (0, 1), (1, 3), (2, 5)', () => {
    const x = [0, 1, 2];
    const y = [1, 3, 5];
    const problem: LeastSquaresProblem = {
      pointCount: 3,
      parameterCount: 2,
      responseSumOfSquares: 35,
      evaluate(p, r, j) {
        let rss = 0;
        for (let i = 0; i < 3; i += 1) {
          r[i] = y[i] - (p[0] + p[1] * x[i]);
          j[2 * i] = 1;
          j[2 * i + 1] = x[i];
          rss += r[i] * r[i];
        }
        return rss;
      },
    };
    const result = levenbergMarquardt(problem, [0, 0]);
    expect(result.parameters[0]).toBeCloseTo(1, 12);
    expect(result.parameters[1]).toBeCloseTo(2, 12);
    expect(result.converged).toBe(true);
    // JᵀJ = [[3, 3], [3, 5]] for these x.
    expect(result.normalMatrix).toEqual([3, 3, 3, 5]);
  });

  it('finds the minimum of Rosenbrock’s function from (−1.2, 1) (Moré, Garbow & Hillstrom 1981, problem 1)', () => {
    // r = (10·(θ₂ − θ₁²), 1 − θ₁), minimum 0 at (1, 1): a curved valley that defeats undamped Gauss–Newton.
    const problem: LeastSquaresProblem = {
      pointCount: 2,
      parameterCount: 2,
      responseSumOfSquares: 1,
      evaluate(p, r, j) {
        r[0] = -10 * (p[1] - p[0] * p[0]);
        r[1] = -(1 - p[0]);
        // The solver's Jacobian is of the model f with r = y − f, so J = −∂r/∂θ.
        j[0] = -20 * p[0];
        j[1] = 10;
        j[2] = -1;
        j[3] = 0;
        return r[0] * r[0] + r[1] * r[1];
      },
    };
    const result = levenbergMarquardt(problem, [-1.2, 1]);
    expect(result.parameters[0]).toBeCloseTo(1, 10);
    expect(result.parameters[1]).toBeCloseTo(1, 10);
    expect(result.converged).toBe(true);
  });

  it('rejects steps outside the model’s domain (non-finite RSS) and still converges inside it', () => {
    // y = √θ·x fitted to y = 2x: θ = 4, but a first full step from θ = 0.01 would overshoot below zero.
    const x = [1, 2, 3];
    const problem: LeastSquaresProblem = {
      pointCount: 3,
      parameterCount: 1,
      responseSumOfSquares: 56,
      evaluate(p, r, j) {
        let rss = 0;
        for (let i = 0; i < 3; i += 1) {
          r[i] = 2 * x[i] - Math.sqrt(p[0]) * x[i];
          j[i] = x[i] / (2 * Math.sqrt(p[0]));
          rss += r[i] * r[i];
        }
        return rss;
      },
    };
    const result = levenbergMarquardt(problem, [0.01]);
    expect(result.parameters[0]).toBeCloseTo(4, 10);
  });

  it('reports non-convergence when the minimum lies at infinity', () => {
    // y = exp(−θ·x) fitted to y = 0: the RSS falls for ever as θ grows.
    const x = [1, 2, 3];
    const problem: LeastSquaresProblem = {
      pointCount: 3,
      parameterCount: 1,
      responseSumOfSquares: 0,
      evaluate(p, r, j) {
        let rss = 0;
        for (let i = 0; i < 3; i += 1) {
          const f = Math.exp(-p[0] * x[i]);
          r[i] = -f;
          j[i] = -x[i] * f;
          rss += f * f;
        }
        return rss;
      },
    };
    const result = levenbergMarquardt(problem, [0]);
    expect(result.converged).toBe(false);
    expect(result.iterations).toBeLessThanOrEqual(MAX_ITERATIONS);
  });

  it('throws RangeError for starting values of the wrong length or outside the domain', () => {
    const problem: LeastSquaresProblem = {
      pointCount: 1,
      parameterCount: 1,
      responseSumOfSquares: 1,
      evaluate: () => Number.NaN,
    };
    expect(() => levenbergMarquardt(problem, [1, 2])).toThrow(new RangeError('levenbergMarquardt requires 1 starting values'));
    expect(() => levenbergMarquardt(problem, [1])).toThrow(
      new RangeError('levenbergMarquardt requires starting values inside the model domain'),
    );
  });
});
