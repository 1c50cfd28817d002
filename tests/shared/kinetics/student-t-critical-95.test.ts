import { describe, expect, it } from 'vitest';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import { studentTCritical95 } from '../../../shared/kinetics/student-t-critical-95';
import { loadScipyFixture, relativeError } from './test-helpers';

describe('studentTCritical95', () => {
  it('matches SciPy stats.t.ppf(0.975, df) to 5e-8 relative (jstat’s incomplete-beta accuracy)', () => {
    const fixture = loadScipyFixture<{ quantiles: { df: number; t: number }[] }>('student-t');
    expect(fixture.quantiles.length).toBeGreaterThan(10);
    for (const { df, t } of fixture.quantiles) {
      expect(relativeError(studentTCritical95(df), t)).toBeLessThan(5e-8);
    }
  });

  it('gives the textbook value t(0.975, 1) = tan(0.475·π) = 12.7062… (Cauchy distribution)', () => {
    expect(relativeError(studentTCritical95(1), Math.tan(0.475 * Math.PI))).toBeLessThan(1e-9);
  });

  it('returns the same value on repeated calls (cached)', () => {
    expect(studentTCritical95(17)).toBe(studentTCritical95(17));
  });

  it.each([0, -1, 2.5, Number.NaN])('throws KineticsInputError for %s degrees of freedom', (df) => {
    expect(() => studentTCritical95(df)).toThrow(
      new KineticsInputError('studentTCritical95 requires a positive integer number of degrees of freedom'),
    );
  });
});
