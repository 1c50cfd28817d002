import { describe, expect, it } from 'vitest';
import { fitHill } from '../../../shared/kinetics/fit-hill';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import type { RatePoint } from '../../../shared/kinetics/types';
import { deepFreeze, loadScipyFixture, relativeError, type ScipyFixtureSet } from './test-helpers';

const hill = (s: number, vmax: number, khalf: number, n: number) => (vmax * s ** n) / (khalf ** n + s ** n);

describe('fitHill', () => {
  it('recovers the parameters of noise-free sigmoid data, including a point at S = 0', () => {
    const points = [0, 0.5, 1, 2, 4, 8, 16].map((s) => ({ s, v: hill(s, 10, 2, 2.5) }));
    const fit = fitHill(points);
    expect(fit.parameters.vmax.value).toBeCloseTo(10, 9);
    expect(fit.parameters.khalf.value).toBeCloseTo(2, 9);
    expect(fit.parameters.hill.value).toBeCloseTo(2.5, 9);
    expect(fit.residuals[0]).toBe(0);
  });

  it('reduces to Michaelis–Menten for n = 1 data: v = 3·S/(2 + S)', () => {
    const points = [0.5, 1, 2, 4, 8, 16].map((s) => ({ s, v: (3 * s) / (2 + s) }));
    const fit = fitHill(points);
    expect(fit.parameters.hill.value).toBeCloseTo(1, 9);
    expect(fit.parameters.khalf.value).toBeCloseTo(2, 9);
  });

  describe('cross-check against SciPy curve_fit on 80 generated data sets (fixture)', () => {
    // Expected values from tests/fixtures/kinetics/generate_scipy_fixtures.py (SciPy curve_fit, analytic
    // Jacobian, started at the true parameters); the engine starts from its own Hill-plot estimate.
    const fixture = loadScipyFixture<{ sets: ScipyFixtureSet<RatePoint>[] }>('hill');

    it('agrees on Vmax, K½, n, their SEs and the RSS', () => {
      expect(fixture.sets).toHaveLength(80);
      expect(fixture.sets.some((set) => set.points.some((point) => point.s === 0))).toBe(true);
      for (const set of fixture.sets) {
        const fit = fitHill(set.points);
        expect(fit.converged).toBe(true);
        for (const name of ['vmax', 'khalf', 'hill']) {
          expect(relativeError(fit.parameters[name].value, set.expected[name].value)).toBeLessThan(1e-7);
          expect(relativeError(fit.parameters[name].se, set.expected[name].se)).toBeLessThan(2e-7);
        }
        expect(relativeError(fit.rss, set.rss)).toBeLessThan(1e-10);
      }
    });
  });

  it('does not modify its input', () => {
    const points = deepFreeze([0.5, 1, 2, 4, 8].map((s) => ({ s, v: hill(s, 5, 1, 2) })));
    expect(() => fitHill(points)).not.toThrow();
  });

  describe('degenerate input throws KineticsInputError', () => {
    const cases: [string, RatePoint[], string][] = [
      ['three points', [{ s: 1, v: 1 }, { s: 2, v: 2 }, { s: 3, v: 2.5 }], 'fitHill requires at least four points with distinct substrate concentrations'],
      ['infinite S', [{ s: Number.POSITIVE_INFINITY, v: 1 }, { s: 2, v: 2 }, { s: 3, v: 2 }, { s: 4, v: 1 }], 'fitHill requires finite, non-negative substrate concentrations (points[0])'],
      ['all v zero', [{ s: 1, v: 0 }, { s: 2, v: 0 }, { s: 3, v: 0 }, { s: 4, v: 0 }], 'fitHill requires at least one non-zero rate'],
      ['negative weight', [{ s: 1, v: 1, weight: 1 }, { s: 2, v: 2, weight: -1 }, { s: 3, v: 2, weight: 1 }, { s: 4, v: 1, weight: 1 }], 'fitHill requires finite, positive weights (points[1])'],
    ];
    it.each(cases)('%s', (_label, points, message) => {
      expect(() => fitHill(points)).toThrow(new KineticsInputError(message));
    });
  });
});
