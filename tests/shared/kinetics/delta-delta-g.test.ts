import { describe, expect, it } from 'vitest';
import { deltaDeltaGActivation } from '../../../shared/kinetics/delta-delta-g';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';

describe('deltaDeltaGActivation', () => {
  it('gives RT·ln 10 at 298.15 K = 5.7080095 kJ/mol = 1.3642470 kcal/mol for a tenfold slower variant', () => {
    // Issue 3, check 3: R = 8.31446261815324 J/(mol·K) (exact, SI 2019), thermochemical calorie 4.184 J;
    // the common-practice rule of thumb is "1.36 kcal/mol per tenfold change in rate at 25 °C".
    const result = deltaDeltaGActivation({ value: 1, se: 0 }, { value: 10, se: 0 }, 298.15);
    expect(result.kJPerMol.value).toBeCloseTo(5.7080095, 7);
    expect(result.kJPerMol.value.toFixed(6)).toBe('5.708010');
    expect(result.kcalPerMol.value).toBeCloseTo(1.364247, 6);
    expect(result.kJPerMol.se).toBe(0);
  });

  it('is positive when the variant is slower and negative when it is faster, with the sign exactly mirrored', () => {
    const slower = deltaDeltaGActivation({ value: 2e3, se: 0 }, { value: 2e5, se: 0 }, 310.15);
    const faster = deltaDeltaGActivation({ value: 2e5, se: 0 }, { value: 2e3, se: 0 }, 310.15);
    expect(slower.kJPerMol.value).toBeGreaterThan(0);
    expect(faster.kJPerMol.value).toBeCloseTo(-slower.kJPerMol.value, 12);
    // The assay temperature enters: 2·RT·ln 10 at 310.15 K (37 °C), by hand.
    expect(slower.kJPerMol.value).toBeCloseTo((2 * 8.31446261815324 * 310.15 * Math.LN10) / 1000, 10);
  });

  it('propagates relative standard errors: se = RT·√((se_v/k_v)² + (se_p/k_p)²)', () => {
    // 10 % and 5 % relative errors at 298.15 K: RT·√(0.01 + 0.0025) = 2.47896 kJ/mol × 0.111803.
    const result = deltaDeltaGActivation({ value: 50, se: 5 }, { value: 100, se: 5 }, 298.15);
    const rtKilojoules = (8.31446261815324 * 298.15) / 1000;
    expect(result.kJPerMol.se).toBeCloseTo(rtKilojoules * Math.sqrt(0.0125), 12);
    expect(result.kcalPerMol.se).toBeCloseTo((rtKilojoules * Math.sqrt(0.0125)) / 4.184, 12);
  });

  describe('throws KineticsInputError for input that is not a rate constant or a temperature', () => {
    it.each([0, -1, Number.NaN, Number.POSITIVE_INFINITY])('variant rate %s', (value) => {
      expect(() => deltaDeltaGActivation({ value, se: 0 }, { value: 1, se: 0 }, 298.15)).toThrow(
        new KineticsInputError('deltaDeltaGActivation requires a finite, positive rate constant (variant)'),
      );
    });
    it('negative standard error of the parent', () => {
      expect(() => deltaDeltaGActivation({ value: 1, se: 0 }, { value: 1, se: -1 }, 298.15)).toThrow(
        new KineticsInputError('deltaDeltaGActivation requires a finite, non-negative standard error (parent)'),
      );
    });
    it.each([0, -273, Number.NaN])('temperature %s K', (temperature) => {
      expect(() => deltaDeltaGActivation({ value: 1, se: 0 }, { value: 1, se: 0 }, temperature)).toThrow(
        new KineticsInputError('deltaDeltaGActivation requires a finite, positive temperature in kelvin'),
      );
    });
  });
});
