import { describe, expect, it } from 'vitest';
import { fitSubstrateInhibition } from '../../../shared/kinetics/fit-substrate-inhibition';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import type { RatePoint } from '../../../shared/kinetics/types';
import { allNumbers, deepFreeze, loadScipyFixture, relativeError, type ScipyFixtureSet } from './test-helpers';

const haldane = (s: number, vmax: number, km: number, ki: number) => (vmax * s) / (km + s + (s * s) / ki);

describe('fitSubstrateInhibition', () => {
  it('recovers the parameters of noise-free data (the algebra of the model)', () => {
    const points = [0.25, 0.5, 1, 2, 4, 8, 16, 32].map((s) => ({ s, v: haldane(s, 10, 1, 8) }));
    const fit = fitSubstrateInhibition(points);
    expect(fit.parameters.vmax.value).toBeCloseTo(10, 9);
    expect(fit.parameters.km.value).toBeCloseTo(1, 9);
    expect(fit.parameters.ki.value).toBeCloseTo(8, 9);
    expect(fit.fittedParameters).toEqual(['vmax', 'km', 'ki']);
    expect(fit.df).toBe(5);
  });

  describe('cross-check against SciPy curve_fit on 80 generated data sets (fixture)', () => {
    // Expected values from tests/fixtures/kinetics/generate_scipy_fixtures.py (SciPy curve_fit fitting Ki
    // directly, analytic Jacobian). The engine fits 1/Ki and maps back; the optimum and the linearised
    // standard errors must be the same. Tolerance as for Michaelis–Menten (curve_fit's own ~1e-8).
    const fixture = loadScipyFixture<{ sets: ScipyFixtureSet<RatePoint>[] }>('substrate-inhibition');

    it('agrees on Vmax, Km, Ki, their SEs and the RSS', () => {
      expect(fixture.sets).toHaveLength(80);
      for (const set of fixture.sets) {
        const fit = fitSubstrateInhibition(set.points);
        expect(fit.converged).toBe(true);
        for (const name of ['vmax', 'km', 'ki']) {
          expect(relativeError(fit.parameters[name].value, set.expected[name].value)).toBeLessThan(1e-7);
          expect(relativeError(fit.parameters[name].se, set.expected[name].se)).toBeLessThan(1e-7);
        }
        expect(relativeError(fit.rss, set.rss)).toBeLessThan(1e-10);
      }
    });
  });

  it('reports the covariance in Ki, consistent with the reported SEs', () => {
    const points = [0.25, 0.5, 1, 2, 4, 8, 16, 32].map((s, i) => ({ s, v: haldane(s, 10, 1, 8) * (1 + 0.03 * Math.sin(3 * i)) }));
    const fit = fitSubstrateInhibition(points);
    fit.fittedParameters.forEach((name, j) => {
      expect(Math.sqrt(fit.covariance[j][j])).toBeCloseTo(fit.parameters[name].se, 12);
    });
  });

  it('warns that Ki is not determined when the data show no inhibition', () => {
    // Michaelis–Menten data that rise slightly faster than hyperbolic: the best 1/Ki is negative.
    const points = [0.25, 0.5, 1, 2, 4, 8, 16, 32].map((s, i) => ({
      s,
      v: ((10 * s) / (1 + s)) * (1 + 0.01 * ((i % 3) - 1)) * (1 + 0.002 * s),
    }));
    const fit = fitSubstrateInhibition(points);
    expect(fit.parameters.ki.value).toBeLessThan(0);
    expect(fit.warnings).toEqual([
      `ki is not positive (${Number(fit.parameters.ki.value.toPrecision(3))}); the model does not describe these data`,
      'the data show no substrate inhibition (1/Ki is not positive), so Ki is not determined; use the Michaelis–Menten model',
    ]);
    expect(allNumbers(fit).some(Number.isNaN)).toBe(false);
  });

  it('does not modify its input', () => {
    const points = deepFreeze([0.5, 1, 2, 4, 8].map((s) => ({ s, v: haldane(s, 5, 1, 4) })));
    expect(() => fitSubstrateInhibition(points)).not.toThrow();
  });

  describe('degenerate input throws KineticsInputError', () => {
    const cases: [string, RatePoint[], string][] = [
      ['three distinct S', [{ s: 1, v: 1 }, { s: 2, v: 2 }, { s: 3, v: 2 }, { s: 3, v: 2.1 }], 'fitSubstrateInhibition requires at least four points with distinct substrate concentrations'],
      ['negative S', [{ s: -1, v: 1 }, { s: 2, v: 2 }, { s: 3, v: 2 }, { s: 4, v: 1 }], 'fitSubstrateInhibition requires finite, non-negative substrate concentrations (points[0])'],
      ['NaN v', [{ s: 1, v: 1 }, { s: 2, v: Number.NaN }, { s: 3, v: 2 }, { s: 4, v: 1 }], 'fitSubstrateInhibition requires finite rates (points[1])'],
      ['all v zero', [{ s: 1, v: 0 }, { s: 2, v: 0 }, { s: 3, v: 0 }, { s: 4, v: 0 }], 'fitSubstrateInhibition requires at least one non-zero rate'],
      ['weights on some points', [{ s: 1, v: 1 }, { s: 2, v: 2, weight: 2 }, { s: 3, v: 2 }, { s: 4, v: 1 }], 'fitSubstrateInhibition requires a weight on every point or on none'],
    ];
    it.each(cases)('%s', (_label, points, message) => {
      expect(() => fitSubstrateInhibition(points)).toThrow(new KineticsInputError(message));
    });
  });
});
