import { describe, expect, it } from 'vitest';
import { compareModels } from '../../../shared/kinetics/compare-models';
import { fitMichaelisMenten } from '../../../shared/kinetics/fit-michaelis-menten';
import { fitSubstrateInhibition } from '../../../shared/kinetics/fit-substrate-inhibition';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import type { FitResult, RatePoint } from '../../../shared/kinetics/types';
import { loadScipyFixture, relativeError } from './test-helpers';

/** A fit result with only what compareModels reads set to meaningful values. */
function fitWith(rss: number, n: number, parameterCount: number, converged = true): FitResult {
  return {
    model: 'michaelis-menten',
    parameters: {},
    fittedParameters: [],
    covariance: [],
    rss,
    residualSd: Math.sqrt(rss / (n - parameterCount)),
    df: n - parameterCount,
    n,
    iterations: 1,
    converged,
    residuals: new Array<number>(n).fill(0),
    warnings: [],
  };
}

describe('compareModels', () => {
  describe('by hand: n = 10, RSS 20 with 2 parameters against RSS 10 with 3', () => {
    const comparison = compareModels(fitWith(20, 10, 2), fitWith(10, 10, 3));

    it('computes AICc = n·ln(RSS/n) + 2K + 2K(K + 1)/(n − K − 1) with K = p + 1 (Burnham & Anderson 2002)', () => {
      // Simpler: 10·ln 2 + 6 + 24/6 = 16.931471805599453; richer: 10·ln 1 + 8 + 40/5 = 16.
      expect(comparison.simpler.aicc).toBeCloseTo(10 * Math.LN2 + 10, 12);
      expect(comparison.richer.aicc).toBeCloseTo(16, 12);
      expect(comparison.deltaAicc).toBeCloseTo(16 - (10 * Math.LN2 + 10), 12);
      expect(comparison.richerAkaikeWeight).toBeCloseTo(1 / (1 + Math.exp(comparison.deltaAicc / 2)), 12);
    });

    it('computes the extra-sum-of-squares F = (10/1)/(10/7) = 7 and its p-value (SciPy stats.f.sf(7, 1, 7))', () => {
      const scipy = loadScipyFixture<{ fSurvival: { value: number } }>('student-t');
      expect(comparison.fStatistic).toBeCloseTo(7, 12);
      expect(comparison.fDegreesOfFreedom).toEqual([1, 7]);
      expect(relativeError(comparison.pValue, scipy.fSurvival.value)).toBeLessThan(1e-7);
    });

    it('prefers the richer model when both criteria favour it', () => {
      expect(comparison.preferred).toBe('richer');
      expect(comparison.reason).toBe('the richer model is supported: lower AICc (ΔAICc = -0.93) and F test p = 0.033 < 0.05');
      expect(comparison.warnings).toEqual([]);
    });
  });

  it('keeps the simpler model when the extra parameter buys little', () => {
    const comparison = compareModels(fitWith(20, 10, 2), fitWith(19, 10, 3));
    expect(comparison.preferred).toBe('simpler');
    expect(comparison.reason.startsWith('the extra parameter is not supported')).toBe(true);
  });

  it('keeps the simpler model when the criteria disagree', () => {
    // n = 40: F = 1.2/(17.5/37) ≈ 2.54 (p ≈ 0.12), while ΔAICc = 40·ln(17.5/18.7) + 2 + 0.476 ≈ −0.18.
    const comparison = compareModels(fitWith(18.7, 40, 2), fitWith(17.5, 40, 3));
    expect(comparison.deltaAicc).toBeLessThan(0);
    expect(comparison.pValue).toBeGreaterThan(0.05);
    expect(comparison.preferred).toBe('simpler');
    expect(comparison.reason.startsWith('the criteria disagree')).toBe(true);
  });

  it('warns when the richer fit is worse, which means it missed its optimum', () => {
    const comparison = compareModels(fitWith(10, 10, 2), fitWith(12, 10, 3));
    expect(comparison.pValue).toBe(1);
    expect(comparison.warnings).toContain(
      'the richer model fits no better than the simpler one; its fit may not have reached the optimum',
    );
  });

  it('warns when a fit did not converge', () => {
    const comparison = compareModels(fitWith(20, 10, 2, false), fitWith(10, 10, 3));
    expect(comparison.warnings).toContain('at least one of the fits did not converge, so the comparison is not reliable');
  });

  describe('cross-check against SciPy on 30 generated substrate-inhibition data sets (fixture)', () => {
    // tests/fixtures/kinetics/generate_scipy_fixtures.py fitted each set with curve_fit under both models,
    // then AICc by the formula above and the p-value with scipy.stats.f.sf.
    type Side = { rss: number; aicc: number };
    const fixture = loadScipyFixture<{
      sets: { points: RatePoint[]; simpler: Side; richer: Side; fStatistic: number; pValue: number }[];
    }>('compare-models');

    it('agrees on RSS, AICc, F and p for Michaelis–Menten against substrate inhibition', () => {
      expect(fixture.sets).toHaveLength(30);
      for (const set of fixture.sets) {
        const comparison = compareModels(fitMichaelisMenten(set.points), fitSubstrateInhibition(set.points));
        expect(relativeError(comparison.simpler.rss, set.simpler.rss)).toBeLessThan(1e-10);
        expect(relativeError(comparison.richer.rss, set.richer.rss)).toBeLessThan(1e-10);
        expect(comparison.simpler.aicc).toBeCloseTo(set.simpler.aicc, 8);
        expect(comparison.richer.aicc).toBeCloseTo(set.richer.aicc, 8);
        expect(relativeError(comparison.fStatistic, set.fStatistic)).toBeLessThan(1e-7);
        // jstat's incomplete beta is good to about 1e-8 relative; tiny p-values to an absolute 1e-12.
        expect(Math.abs(comparison.pValue - set.pValue)).toBeLessThan(Math.max(1e-7 * set.pValue, 1e-12));
      }
    });
  });

  describe('refuses comparisons that mean nothing', () => {
    it('different data sets', () => {
      expect(() => compareModels(fitWith(20, 10, 2), fitWith(10, 11, 3))).toThrow(
        new KineticsInputError('compareModels requires two fits of the same data points'),
      );
    });
    it('a richer model without more parameters', () => {
      expect(() => compareModels(fitWith(20, 10, 3), fitWith(10, 10, 3))).toThrow(
        new KineticsInputError('compareModels requires the richer model to have more parameters'),
      );
    });
    it('too few points for AICc', () => {
      expect(() => compareModels(fitWith(20, 5, 2), fitWith(10, 5, 3))).toThrow(
        new KineticsInputError('compareModels requires at least 6 points for AICc with 3 parameters'),
      );
    });
    it('an exact fit', () => {
      expect(() => compareModels(fitWith(20, 10, 2), fitWith(0, 10, 3))).toThrow(
        new KineticsInputError('compareModels requires fits with a non-zero residual sum of squares'),
      );
    });
  });
});
