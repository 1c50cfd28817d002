import { describe, expect, it } from 'vitest';
import { substrateInhibitionCurve } from '../../../shared/kinetics/substrate-inhibition-curve';
import { jacobianError } from './test-helpers';

describe('substrateInhibitionCurve', () => {
  it('evaluates v = Vmax·S/(Km + S + u·S²) with u = 1/Ki', () => {
    const values = [0, 0];
    substrateInhibitionCurve([2, 0], [10, 2, 0.5], values, null);
    expect(values[0]).toBeCloseTo(20 / 6, 14);
    expect(values[1]).toBe(0);
  });

  it('peaks at S = √(Km·Ki), the optimum of the Haldane equation', () => {
    const km = 1;
    const ki = 16;
    const values = [0, 0, 0];
    substrateInhibitionCurve([3.9, 4, 4.1], [10, km, 1 / ki], values, null);
    expect(values[1]).toBeGreaterThan(values[0]);
    expect(values[1]).toBeGreaterThan(values[2]);
  });

  it('writes the analytic Jacobian, which agrees with central finite differences', () => {
    expect(jacobianError(substrateInhibitionCurve, [0, 0.1, 1, 3, 30], [10, 2, 0.05])).toBeLessThan(1e-8);
  });
});
