import { describe, expect, it } from 'vitest';
import type { LevenbergMarquardtResult } from '../../../shared/kinetics/levenberg-marquardt';
import { studentTCritical95 } from '../../../shared/kinetics/student-t-critical-95';
import { summarizeFit, type QuantitySpec } from '../../../shared/kinetics/summarize-fit';

const solution = (overrides: Partial<LevenbergMarquardtResult> = {}): LevenbergMarquardtResult => ({
  parameters: [2, 3],
  residuals: [0.2, -0.4, 0.6, 0],
  rss: 0.56,
  normalMatrix: [1, 0, 0, 1],
  iterations: 4,
  converged: true,
  ...overrides,
});
const SPECS: QuantitySpec[] = [
  { name: 'a', mustBePositive: true, scale: 'ratio' },
  { name: 'pKa', mustBePositive: false, scale: 'ph' },
];

describe('summarizeFit', () => {
  it('builds estimates with Wald intervals, residual SD and df = n − p', () => {
    const fit = summarizeFit({ model: 'ph-acid', fitted: SPECS, values: [2, 3], covariance: [[0.01, 0], [0, 0.04]], solution: solution(), weightRoot: null });
    expect(fit.df).toBe(2);
    expect(fit.n).toBe(4);
    expect(fit.residualSd).toBeCloseTo(Math.sqrt(0.28), 15);
    expect(fit.parameters.a.se).toBeCloseTo(0.1, 15);
    expect(fit.parameters.a.ci95[1]).toBeCloseTo(2 + studentTCritical95(2) * 0.1, 14);
    expect(fit.fittedParameters).toEqual(['a', 'pKa']);
    expect(fit.warnings).toEqual([]);
  });

  it('turns weighted residuals back into response units', () => {
    const fit = summarizeFit({ model: 'ph-acid', fitted: SPECS, values: [2, 3], covariance: [[0.01, 0], [0, 0.04]], solution: solution(), weightRoot: [2, 2, 0.5, 1] });
    expect(fit.residuals).toEqual([0.1, -0.2, 1.2, 0]);
  });

  it('warns about non-convergence, a non-positive quantity and poorly determined ones, in that order', () => {
    const fit = summarizeFit({
      model: 'ph-acid',
      fitted: SPECS,
      values: [-2, 3],
      covariance: [[4, 0], [0, 0.36]],
      solution: solution({ converged: false, iterations: 200 }),
      weightRoot: null,
    });
    expect(fit.warnings).toEqual([
      'the fit did not converge (stopped after 200 iterations); the estimates are not reliable',
      'a is not positive (-2); the model does not describe these data',
      'a is poorly determined: its standard error is 100 % of its value',
      'pKa is poorly determined: its standard error is 0.6 pH units',
    ]);
  });

  it('reports a singular JᵀJ once, with infinite (not NaN) errors and covariance', () => {
    const fit = summarizeFit({ model: 'ph-acid', fitted: SPECS, values: [2, 3], covariance: null, solution: solution(), weightRoot: null });
    expect(fit.warnings).toEqual([
      'JᵀJ is singular: the parameters cannot all be determined from these data, so their standard errors are infinite',
    ]);
    expect(fit.parameters.a.se).toBe(Number.POSITIVE_INFINITY);
    expect(fit.covariance).toEqual([[Infinity, Infinity], [Infinity, Infinity]]);
  });

  it('adds derived quantities with delta-method errors', () => {
    const fit = summarizeFit({
      model: 'ph-acid',
      fitted: SPECS,
      values: [2, 3],
      covariance: [[0.01, 0.005], [0.005, 0.04]],
      solution: solution(),
      weightRoot: null,
      derived: [{ spec: { name: 'sum', mustBePositive: true, scale: 'ratio' }, value: 5, gradient: [1, 1] }],
    });
    expect(fit.parameters.sum.se).toBeCloseTo(Math.sqrt(0.01 + 0.04 + 0.01), 15);
  });
});
