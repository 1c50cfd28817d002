import { describe, expect, it } from 'vitest';
import { phBellCurve } from '../../../shared/kinetics/ph-bell-curve';
import { jacobianError } from './test-helpers';

describe('phBellCurve', () => {
  it('evaluates k = kmax/(1 + 10^(pKa1 − pH) + 10^(pH − pKa2))', () => {
    const values = [0, 0];
    phBellCurve([6, 5], [1, 5, 7], values, null);
    expect(values[0]).toBeCloseTo(1 / 1.2, 14);
    expect(values[1]).toBeCloseTo(1 / (2 + 0.01), 14);
  });

  it('writes the analytic Jacobian, which agrees with central finite differences', () => {
    expect(jacobianError(phBellCurve, [3, 4.5, 6, 7.5, 9, 10], [2, 5, 8])).toBeLessThan(1e-8);
  });

  it('returns NaN where 10^(pKa − pH) overflows, so the solver rejects such steps', () => {
    const values = [0];
    phBellCurve([0], [1, 400, 8], values, null);
    expect(values[0]).toBeNaN();
  });
});
