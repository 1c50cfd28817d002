import { describe, expect, it } from 'vitest';
import { fitPhProfile } from '../../../shared/kinetics/fit-ph-profile';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import type { Estimate, PhPoint } from '../../../shared/kinetics/types';
import { deepFreeze, loadScipyFixture, relativeError, type ScipyFixtureSet } from './test-helpers';

const bell = (ph: number, kmax: number, pKa1: number, pKa2: number) => kmax / (1 + 10 ** (pKa1 - ph) + 10 ** (ph - pKa2));
const PH_3_TO_10 = Array.from({ length: 15 }, (_, i) => 3 + i / 2);

describe('fitPhProfile', () => {
  describe('noise-free bell, pKa1 = 4.2, pKa2 = 8.4, kmax = 1 at pH 3.0, 3.5, …, 10.0 (issue 3, check 4)', () => {
    const fit = fitPhProfile(
      PH_3_TO_10.map((ph) => ({ ph, k: bell(ph, 1, 4.2, 8.4) })),
      { model: 'bell' },
    );

    it('recovers the parameters to 1e-8', () => {
      expect(Math.abs(fit.parameters.kmax.value - 1)).toBeLessThan(1e-8);
      expect(Math.abs(fit.parameters.pKa1.value - 4.2)).toBeLessThan(1e-8);
      expect(Math.abs(fit.parameters.pKa2.value - 8.4)).toBeLessThan(1e-8);
      expect(fit.model).toBe('ph-bell');
      expect(fit.warnings).toEqual([]);
    });

    it('puts the optimum at (pKa1 + pKa2)/2 = 6.3', () => {
      expect(Math.abs(fit.phOptimum.value - 6.3)).toBeLessThan(1e-8);
    });

    it('gives k at the optimum = kmax/(1 + 2·10^(−(pKa2 − pKa1)/2)) = 0.984361871446 (the algebra of the model)', () => {
      expect(Math.abs(fit.kAtOptimum.value - 0.984361871446)).toBeLessThan(1e-11);
    });
  });

  describe('cross-check against SciPy curve_fit on generated data sets (fixtures)', () => {
    // Expected values from tests/fixtures/kinetics/generate_scipy_fixtures.py: SciPy curve_fit (analytic
    // Jacobian) of k on its linear scale, a quarter of the sets weighted. phOptimum and kAtOptimum come from
    // curve_fit refits of the same data in the parametrisations (optimum, kmax, half-separation) and
    // (k at optimum, optimum, half-separation), whose SEs check the engine's delta-method SEs.
    it('agrees on the bell (80 sets), including the pH optimum and k at the optimum with their SEs', () => {
      const fixture = loadScipyFixture<{ sets: ScipyFixtureSet<PhPoint>[] }>('ph-bell');
      expect(fixture.sets).toHaveLength(80);
      for (const set of fixture.sets) {
        const fit = fitPhProfile(set.points, { model: 'bell' });
        expect(fit.converged).toBe(true);
        const estimates: Record<string, Estimate> = { ...fit.parameters, phOptimum: fit.phOptimum, kAtOptimum: fit.kAtOptimum };
        for (const name of ['kmax', 'pKa1', 'pKa2', 'phOptimum', 'kAtOptimum']) {
          expect(relativeError(estimates[name].value, set.expected[name].value)).toBeLessThan(1e-8);
          expect(relativeError(estimates[name].se, set.expected[name].se)).toBeLessThan(1e-7);
        }
        expect(relativeError(fit.rss, set.rss)).toBeLessThan(1e-10);
      }
    });

    it.each(['acid', 'base'] as const)('agrees on the %s limb (40 sets)', (model) => {
      const fixture = loadScipyFixture<{ sets: ScipyFixtureSet<PhPoint>[] }>(`ph-${model}`);
      expect(fixture.sets).toHaveLength(40);
      for (const set of fixture.sets) {
        const fit = fitPhProfile(set.points, { model });
        expect(fit.model).toBe(`ph-${model}`);
        for (const name of ['kmax', 'pKa']) {
          expect(relativeError(fit.parameters[name].value, set.expected[name].value)).toBeLessThan(1e-8);
          expect(relativeError(fit.parameters[name].se, set.expected[name].se)).toBeLessThan(1e-7);
        }
      }
    });
  });

  it('fits the acid limb k = kmax/(1 + 10^(pKa − pH)) and the base limb k = kmax/(1 + 10^(pH − pKa))', () => {
    const ph = [4, 5, 6, 7, 8, 9];
    const acid = fitPhProfile(ph.map((x) => ({ ph: x, k: 3 / (1 + 10 ** (6.2 - x)) })), { model: 'acid' });
    const base = fitPhProfile(ph.map((x) => ({ ph: x, k: 3 / (1 + 10 ** (x - 6.2)) })), { model: 'base' });
    expect(acid.parameters.pKa.value).toBeCloseTo(6.2, 9);
    expect(base.parameters.pKa.value).toBeCloseTo(6.2, 9);
    expect(acid.parameters.kmax.value).toBeCloseTo(3, 9);
  });

  it('warns when a pKa lies outside the pH range tested', () => {
    const fit = fitPhProfile(
      [6, 6.5, 7, 7.5, 8].map((ph) => ({ ph, k: 3 / (1 + 10 ** (5.5 - ph)) })),
      { model: 'acid' },
    );
    expect(fit.warnings).toContain('pKa (5.50) lies outside the pH range tested (6–8); it is an extrapolation');
  });

  it('warns when the best pKa1 is above pKa2 (overlapping ionizations)', () => {
    // The model with pKa1 = 6.5 > pKa2 = 5.5 is a low, narrow bell that no ordered pair reproduces.
    const fit = fitPhProfile(
      PH_3_TO_10.map((ph) => ({ ph, k: bell(ph, 100, 6.5, 5.5) })),
      { model: 'bell' },
    );
    expect(fit.parameters.pKa1.value).toBeCloseTo(6.5, 6);
    expect(fit.warnings).toContain('pKa1 is not below pKa2, so the two ionizations cannot be assigned from these data');
  });

  it('does not modify its input', () => {
    const points = deepFreeze(PH_3_TO_10.map((ph) => ({ ph, k: bell(ph, 2, 5, 8) })));
    expect(() => fitPhProfile(points, { model: 'bell' })).not.toThrow();
  });

  describe('degenerate input throws KineticsInputError', () => {
    const cases: [string, PhPoint[], 'bell' | 'acid', string][] = [
      ['bell with three pH values', [{ ph: 5, k: 1 }, { ph: 6, k: 2 }, { ph: 7, k: 1 }], 'bell', 'fitPhProfile requires at least four points with distinct pH values'],
      ['limb with two pH values', [{ ph: 5, k: 1 }, { ph: 6, k: 2 }, { ph: 6, k: 2.1 }], 'acid', 'fitPhProfile requires at least three points with distinct pH values'],
      ['NaN pH', [{ ph: Number.NaN, k: 1 }, { ph: 6, k: 2 }, { ph: 7, k: 1 }, { ph: 8, k: 1 }], 'bell', 'fitPhProfile requires finite pH values (points[0])'],
      ['infinite k', [{ ph: 5, k: 1 }, { ph: 6, k: Number.POSITIVE_INFINITY }, { ph: 7, k: 1 }, { ph: 8, k: 1 }], 'bell', 'fitPhProfile requires finite rate constants (points[1])'],
      ['all k zero', [{ ph: 5, k: 0 }, { ph: 6, k: 0 }, { ph: 7, k: 0 }, { ph: 8, k: 0 }], 'bell', 'fitPhProfile requires at least one non-zero rate constant'],
    ];
    it.each(cases)('%s', (_label, points, model, message) => {
      expect(() => fitPhProfile(points, { model })).toThrow(new KineticsInputError(message));
    });
  });
});
