import { describe, expect, it } from 'vitest';
import { phAcidCurve } from '../../../shared/kinetics/ph-acid-curve';
import { jacobianError } from './test-helpers';

describe('phAcidCurve', () => {
  it('evaluates k = kmax/(1 + 10^(pKa − pH)): half of kmax at pH = pKa, rising with pH', () => {
    const values = [0, 0, 0];
    phAcidCurve([4, 5, 6], [2, 5], values, null);
    expect(values[1]).toBeCloseTo(1, 14);
    expect(values[0]).toBeCloseTo(2 / 11, 14);
    expect(values[2]).toBeCloseTo(2 / 1.1, 14);
  });

  it('writes the analytic Jacobian, which agrees with central finite differences', () => {
    expect(jacobianError(phAcidCurve, [3, 4.5, 6, 7.5, 9], [2, 6])).toBeLessThan(1e-8);
  });
});
