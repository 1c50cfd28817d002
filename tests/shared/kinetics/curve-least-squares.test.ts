import { describe, expect, it } from 'vitest';
import { fitCurveLeastSquares } from '../../../shared/kinetics/curve-least-squares';
import { michaelisMentenCurve } from '../../../shared/kinetics/michaelis-menten-curve';
import { phAcidCurve } from '../../../shared/kinetics/ph-acid-curve';

describe('fitCurveLeastSquares', () => {
  it('fits a curve to exact data: v = 10·S/(1 + S)', () => {
    const x = [1, 2, 4];
    const result = fitCurveLeastSquares(michaelisMentenCurve, { x, y: x.map((s) => (10 * s) / (1 + s)), weightRoot: null }, [8, 2]);
    expect(result.parameters[0]).toBeCloseTo(10, 10);
    expect(result.parameters[1]).toBeCloseTo(1, 10);
    expect(result.converged).toBe(true);
  });

  it('weights residuals by √w: a heavily weighted point is fitted almost exactly', () => {
    const x = [4, 5, 6, 7, 8];
    const y = [0.1, 0.55, 0.9, 1.05, 0.98];
    const heavy = [1, 1000, 1, 1, 1].map(Math.sqrt);
    const result = fitCurveLeastSquares(phAcidCurve, { x, y, weightRoot: heavy }, [1, 5]);
    const fitted = [0];
    phAcidCurve([5], result.parameters, fitted, null);
    const unweighted = fitCurveLeastSquares(phAcidCurve, { x, y, weightRoot: null }, [1, 5]);
    const fittedUnweighted = [0];
    phAcidCurve([5], unweighted.parameters, fittedUnweighted, null);
    expect(Math.abs(fitted[0] - 0.55)).toBeLessThan(Math.abs(fittedUnweighted[0] - 0.55) / 10);
    // The solver's residuals are the weighted ones.
    expect(result.residuals[1]).toBeCloseTo(heavy[1] * (0.55 - fitted[0]), 12);
  });
});
