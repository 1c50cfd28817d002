import { describe, expect, it } from 'vitest';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import { validateRateWithError } from '../../../shared/kinetics/validate-rate-with-error';

describe('validateRateWithError', () => {
  it('returns the relative standard error', () => {
    expect(validateRateWithError('f', 'x', { value: 200, se: 10 })).toBe(0.05);
    expect(validateRateWithError('f', 'x', { value: 3, se: 0 })).toBe(0);
  });

  it('throws KineticsInputError naming the function and the argument', () => {
    expect(() => validateRateWithError('f', 'parent', { value: 0, se: 1 })).toThrow(
      new KineticsInputError('f requires a finite, positive rate constant (parent)'),
    );
    expect(() => validateRateWithError('f', 'a', { value: 1, se: -0.1 })).toThrow(
      new KineticsInputError('f requires a finite, non-negative standard error (a)'),
    );
  });
});
