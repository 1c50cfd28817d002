import { describe, expect, it } from 'vitest';
import { phBaseCurve } from '../../../shared/kinetics/ph-base-curve';
import { jacobianError } from './test-helpers';

describe('phBaseCurve', () => {
  it('evaluates k = kmax/(1 + 10^(pH − pKa)): half of kmax at pH = pKa, falling with pH', () => {
    const values = [0, 0, 0];
    phBaseCurve([7, 8, 9], [2, 8], values, null);
    expect(values[1]).toBeCloseTo(1, 14);
    expect(values[0]).toBeCloseTo(2 / 1.1, 14);
    expect(values[2]).toBeCloseTo(2 / 11, 14);
  });

  it('writes the analytic Jacobian, which agrees with central finite differences', () => {
    expect(jacobianError(phBaseCurve, [5, 6.5, 8, 9.5, 11], [2, 8])).toBeLessThan(1e-8);
  });
});
