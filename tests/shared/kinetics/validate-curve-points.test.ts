import { describe, expect, it } from 'vitest';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import { validateCurvePoints } from '../../../shared/kinetics/validate-curve-points';

describe('validateCurvePoints', () => {
  it('copies rate points into arrays in input order, with √weight', () => {
    const data = validateCurvePoints('fitX', 'rate', [{ s: 4, v: 3, weight: 4 }, { s: 1, v: 1, weight: 9 }, { s: 2, v: 2, weight: 1 }], 2);
    expect(data).toEqual({ x: [4, 1, 2], y: [3, 1, 2], weightRoot: [2, 3, 1] });
  });

  it('leaves weightRoot null for unweighted points and accepts negative pH and rates', () => {
    const data = validateCurvePoints('fitX', 'ph', [{ ph: -0.5, k: -1 }, { ph: 1, k: 2 }, { ph: 2, k: 3 }], 2);
    expect(data.weightRoot).toBeNull();
    expect(data.x).toEqual([-0.5, 1, 2]);
  });

  it('counts distinct x, not points', () => {
    const replicates = [{ s: 1, v: 1 }, { s: 1, v: 1.1 }, { s: 2, v: 2 }, { s: 2, v: 2.1 }, { s: 3, v: 2.5 }];
    expect(() => validateCurvePoints('fitX', 'rate', replicates, 2)).not.toThrow();
    expect(() => validateCurvePoints('fitX', 'rate', replicates, 3)).toThrow(
      new KineticsInputError('fitX requires at least four points with distinct substrate concentrations'),
    );
  });

  it('names the function and the first bad point in its message', () => {
    expect(() => validateCurvePoints('fitY', 'rate', [{ s: 1, v: 1 }, { s: 2, v: Number.NaN }], 2)).toThrow(
      new KineticsInputError('fitY requires finite rates (points[1])'),
    );
  });
});
