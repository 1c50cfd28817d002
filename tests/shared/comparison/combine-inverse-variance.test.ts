import { describe, expect, it } from 'vitest';
import { combineInverseVariance } from '../../../shared/comparison/combine-inverse-variance';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';

// Weighted average of Taylor, An Introduction to Error Analysis, 2nd ed. (1997), §7.2, eqs. 7.10–7.12:
// x̄ = Σwᵢxᵢ/Σwᵢ with wᵢ = 1/σᵢ², σ(x̄) = 1/√Σwᵢ. Expected values are worked by hand below.
describe('combineInverseVariance', () => {
  it('weights 10 ± 1 and 12 ± 2 by 1 and 1/4', () => {
    // w = 1 and 0.25; x̄ = (10·1 + 12·0.25)/1.25 = 13/1.25 = 10.4; σ = 1/√1.25 = 0.894427191.
    const combined = combineInverseVariance([
      { value: 10, se: 1 },
      { value: 12, se: 2 },
    ]);
    expect(combined.value).toBeCloseTo(10.4, 12);
    expect(combined.se).toBeCloseTo(0.894427190999916, 12);
    expect(combined.n).toBe(2);
  });

  it('gives the plain mean with the error shrunk by √n for equal errors', () => {
    // Three values 3, 4, 8 with σ = 0.3: mean 5, σ = 0.3/√3 = 0.173205081.
    const combined = combineInverseVariance([
      { value: 3, se: 0.3 },
      { value: 4, se: 0.3 },
      { value: 8, se: 0.3 },
    ]);
    expect(combined.value).toBeCloseTo(5, 12);
    expect(combined.se).toBeCloseTo(0.17320508075688773, 12);
  });

  it('keeps working for standard errors whose squares would underflow', () => {
    // The same 1 : 1/4 weighting as above, scaled by 1e-200 (σ² = 1e-400 is below the double range).
    const combined = combineInverseVariance([
      { value: 10e-200, se: 1e-200 },
      { value: 12e-200, se: 2e-200 },
    ]);
    expect(combined.value / 1e-200).toBeCloseTo(10.4, 10);
    expect(combined.se / 1e-200).toBeCloseTo(0.894427190999916, 10);
  });

  it('returns a single value as it is', () => {
    expect(combineInverseVariance([{ value: 7.5, se: 0.25 }])).toEqual({ value: 7.5, se: 0.25, n: 1 });
  });

  it('lets exact values (se = 0) carry all the weight', () => {
    expect(combineInverseVariance([{ value: 2, se: 0 }, { value: 4, se: 0 }, { value: 100, se: 1 }])).toEqual({ value: 3, se: 0, n: 3 });
  });

  it('refuses an empty list and non-finite or negative inputs', () => {
    expect(() => combineInverseVariance([])).toThrow(new KineticsInputError('combineInverseVariance requires at least one value'));
    for (const bad of [{ value: Number.NaN, se: 1 }, { value: 1, se: Number.POSITIVE_INFINITY }, { value: 1, se: -1 }]) {
      expect(() => combineInverseVariance([{ value: 1, se: 1 }, bad])).toThrow(
        'combineInverseVariance requires finite values and finite, non-negative standard errors (estimates[1])',
      );
    }
  });
});
