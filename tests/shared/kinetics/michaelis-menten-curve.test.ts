import { describe, expect, it } from 'vitest';
import { michaelisMentenCurve } from '../../../shared/kinetics/michaelis-menten-curve';
import { jacobianError } from './test-helpers';

describe('michaelisMentenCurve', () => {
  it('evaluates v = Vmax·S/(Km + S): half of Vmax at S = Km, 0 at S = 0', () => {
    const values = [0, 0, 0];
    michaelisMentenCurve([2, 0, 6], [10, 2], values, null);
    expect(values).toEqual([5, 0, 7.5]);
  });

  it('writes the analytic Jacobian, which agrees with central finite differences', () => {
    expect(jacobianError(michaelisMentenCurve, [0, 0.1, 1, 3, 30], [10, 2])).toBeLessThan(1e-8);
    const values = [0];
    const jacobian = [0, 0];
    michaelisMentenCurve([2], [10, 2], values, jacobian);
    // ∂v/∂Vmax = S/(Km + S) = 0.5, ∂v/∂Km = −Vmax·S/(Km + S)² = −1.25.
    expect(jacobian).toEqual([0.5, -1.25]);
  });
});
