import { describe, expect, it } from 'vitest';
import { hillCurve } from '../../../shared/kinetics/hill-curve';
import { jacobianError } from './test-helpers';

describe('hillCurve', () => {
  it('evaluates v = Vmax·Sⁿ/(K½ⁿ + Sⁿ): half of Vmax at S = K½ whatever n', () => {
    const values = [0, 0, 0];
    hillCurve([1, 2, 0], [10, 2, 2], values, null);
    expect(values[0]).toBeCloseTo(2, 14);
    expect(values[1]).toBeCloseTo(5, 14);
    expect(values[2]).toBe(0);
  });

  it('writes the analytic Jacobian, which agrees with central finite differences on both sides of K½', () => {
    expect(jacobianError(hillCurve, [0.05, 0.5, 2, 8, 80], [10, 2, 2.7])).toBeLessThan(1e-7);
    expect(jacobianError(hillCurve, [0.05, 0.5, 2, 8, 80], [10, 2, 0.6])).toBeLessThan(1e-7);
  });

  it('has no sensitivity to any parameter at S = 0', () => {
    const values = [1];
    const jacobian = [1, 1, 1];
    hillCurve([0], [10, 2, 2], values, jacobian);
    expect(jacobian).toEqual([0, 0, 0]);
  });

  it('saturates cleanly where (K½/S)ⁿ overflows, instead of returning ∞/∞', () => {
    const values = [1];
    const jacobian = [1, 1, 1];
    hillCurve([1e-300], [10, 1, 5], values, jacobian);
    expect(values[0]).toBe(0);
    expect(jacobian.every(Number.isFinite)).toBe(true);
  });

  it('returns NaN outside its domain (K½ ≤ 0 or n ≤ 0), so the solver rejects such steps', () => {
    const values = [0];
    hillCurve([1], [10, -1, 2], values, null);
    expect(values[0]).toBeNaN();
    hillCurve([1], [10, 1, 0], values, null);
    expect(values[0]).toBeNaN();
  });
});
