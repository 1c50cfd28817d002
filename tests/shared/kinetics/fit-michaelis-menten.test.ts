import { describe, expect, it } from 'vitest';
import { fitMichaelisMenten } from '../../../shared/kinetics/fit-michaelis-menten';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import type { RatePoint } from '../../../shared/kinetics/types';
import {
  allNumbers,
  deepFreeze,
  loadScipyFixture,
  logRelativeError,
  relativeError,
  type ScipyFixtureSet,
} from './test-helpers';

// NIST Statistical Reference Datasets, nonlinear regression, Misra1d (lower difficulty):
// y = b1·b2·x/(1 + b2·x), i.e. Michaelis–Menten with Vmax = b1 and Km = 1/b2.
// https://www.itl.nist.gov/div898/strd/nls/data/misra1d.shtml, data and certified values as quoted in issue 3.
const MISRA1D_X = [77.6, 114.9, 141.1, 190.8, 239.9, 289.0, 332.8, 378.4, 434.8, 477.3, 536.8, 593.1, 689.1, 760.0];
const MISRA1D_Y = [10.07, 14.73, 17.94, 23.93, 29.61, 35.18, 40.02, 44.82, 50.76, 55.05, 61.01, 66.4, 75.47, 81.78];
const MISRA1D = MISRA1D_X.map((s, i) => ({ s, v: MISRA1D_Y[i] }));
const MISRA1D_CERTIFIED = {
  b1: 4.3736970754e2,
  b1Sd: 3.6489174345,
  b2: 3.0227324449e-4,
  b2Sd: 2.9334354479e-6,
  rss: 5.6419295283e-2,
  residualSd: 6.8568272111e-2,
};

// Puromycin, treated cells: Treloar (1974), as tabulated by Bates & Watts (1988), Nonlinear Regression
// Analysis and Its Applications; reference fit as printed by R's nls (issue 3): Vm = 212.6837431425
// (SE 6.947), K = 0.06412128168 (SE 0.008281), residual SE 10.93 on 10 df.
const PUROMYCIN_S = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1];
const PUROMYCIN_V = [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200];
const PUROMYCIN: RatePoint[] = PUROMYCIN_S.map((s, i) => ({ s, v: PUROMYCIN_V[i] }));

describe('fitMichaelisMenten', () => {
  describe('NIST StRD Misra1d (certified values)', () => {
    const fit = fitMichaelisMenten(MISRA1D);
    const vmax = fit.parameters.vmax;
    const km = fit.parameters.km;

    it('matches b1 = Vmax and its SD to at least 8 significant digits', () => {
      expect(logRelativeError(vmax.value, MISRA1D_CERTIFIED.b1)).toBeGreaterThanOrEqual(8);
      expect(logRelativeError(vmax.se, MISRA1D_CERTIFIED.b1Sd)).toBeGreaterThanOrEqual(8);
    });

    it('matches b2 = 1/Km and its SD to at least 8 significant digits', () => {
      // se(b2) = se(Km)/Km², the exact reparametrisation of the linearised covariance.
      expect(logRelativeError(1 / km.value, MISRA1D_CERTIFIED.b2)).toBeGreaterThanOrEqual(8);
      expect(logRelativeError(km.se / km.value ** 2, MISRA1D_CERTIFIED.b2Sd)).toBeGreaterThanOrEqual(8);
    });

    it('matches Km = 3308.26501594 ± 32.10532869 (the certified values as Michaelis–Menten, issue 3)', () => {
      expect(logRelativeError(km.value, 3308.26501594)).toBeGreaterThanOrEqual(8);
      expect(logRelativeError(km.se, 32.10532869)).toBeGreaterThanOrEqual(8);
    });

    it('matches the certified residual sum of squares and residual SD to at least 8 digits', () => {
      expect(logRelativeError(fit.rss, MISRA1D_CERTIFIED.rss)).toBeGreaterThanOrEqual(8);
      expect(logRelativeError(fit.residualSd, MISRA1D_CERTIFIED.residualSd)).toBeGreaterThanOrEqual(8);
      expect(fit.df).toBe(12);
      expect(fit.n).toBe(14);
      expect(fit.converged).toBe(true);
      expect(fit.warnings).toEqual([]);
    });
  });

  describe('Puromycin, treated (Bates & Watts 1988; R nls reference output)', () => {
    const fit = fitMichaelisMenten(PUROMYCIN);

    it('matches Vm and K within 1e-6 relative', () => {
      expect(relativeError(fit.parameters.vmax.value, 212.6837431425)).toBeLessThan(1e-6);
      expect(relativeError(fit.parameters.km.value, 0.06412128168)).toBeLessThan(1e-6);
    });

    it('matches the printed standard errors and residual SE to the digits R prints', () => {
      expect(fit.parameters.vmax.se).toBeCloseTo(6.947, 3);
      expect(fit.parameters.km.se).toBeCloseTo(0.008281, 6);
      expect(fit.residualSd).toBeCloseTo(10.93, 2);
      expect(fit.df).toBe(10);
    });

    it('gives 95 % intervals value ± t(0.975, 10)·se (t from SciPy stats.t.ppf: 2.228138851986274)', () => {
      const { value, se, ci95 } = fit.parameters.vmax;
      // jstat's quantile is good to a few parts in 10⁸, hence 1e-7.
      expect(relativeError(ci95[1] - value, 2.228138851986274 * se)).toBeLessThan(1e-7);
      expect(relativeError(value - ci95[0], 2.228138851986274 * se)).toBeLessThan(1e-7);
    });

    it('returns unweighted residuals v − fitted in input order', () => {
      const { vmax, km } = fit.parameters;
      fit.residuals.forEach((residual, i) => {
        const fitted = (vmax.value * PUROMYCIN_S[i]) / (km.value + PUROMYCIN_S[i]);
        expect(residual).toBeCloseTo(PUROMYCIN_V[i] - fitted, 9);
      });
    });

    it('derives kcat and kcat/Km, the latter with its SE from the full covariance', () => {
      const withEnzyme = fitMichaelisMenten(PUROMYCIN, { enzymeConcentration: 2 });
      const { vmax, km, kcat, kcatOverKm } = withEnzyme.parameters;
      expect(kcat.value).toBeCloseTo(vmax.value / 2, 10);
      expect(kcat.se).toBeCloseTo(vmax.se / 2, 10);
      expect(kcatOverKm.value).toBeCloseTo(vmax.value / (2 * km.value), 8);
      // SciPy curve_fit of the same data in the form v = a·S/(1 + S/K), a = Vmax/Km (one-off run):
      // a = 3316.897883978669, se(a) = 352.44299459385684. Reparametrising transforms the linearised
      // covariance exactly as the delta method does, so with [E] = 2 the SE must be half of that.
      expect(relativeError(kcatOverKm.se, 352.44299459385684 / 2)).toBeLessThan(1e-6);
      // Treating Vmax and Km as independent would give a visibly different (larger) error here.
      const independent = kcatOverKm.value * Math.hypot(vmax.se / vmax.value, km.se / km.value);
      expect(relativeError(independent, kcatOverKm.se)).toBeGreaterThan(0.05);
    });
  });

  describe('cross-check against SciPy curve_fit on 200 generated data sets (fixture)', () => {
    // Expected values computed once by tests/fixtures/kinetics/generate_scipy_fixtures.py with SciPy's
    // curve_fit (MINPACK LM, analytic Jacobian) and committed; a quarter of the sets are weighted. curve_fit
    // stops on an RSS test that leaves its answer ~1e-8 from the optimum on the flattest sets, hence 1e-7.
    const fixture = loadScipyFixture<{ sets: ScipyFixtureSet<RatePoint>[] }>('michaelis-menten');

    it('has the sets the generator promises', () => {
      expect(fixture.sets).toHaveLength(200);
      expect(fixture.sets.some((set) => set.points[0].weight !== undefined)).toBe(true);
    });

    it('agrees on Vmax, Km, their SEs, kcat/Km ([E] = 1) and the RSS', () => {
      for (const set of fixture.sets) {
        const fit = fitMichaelisMenten(set.points, { enzymeConcentration: 1 });
        expect(fit.converged).toBe(true);
        for (const name of ['vmax', 'km', 'kcatOverKm']) {
          expect(relativeError(fit.parameters[name].value, set.expected[name].value)).toBeLessThan(1e-7);
          expect(relativeError(fit.parameters[name].se, set.expected[name].se)).toBeLessThan(1e-7);
        }
        expect(relativeError(fit.rss, set.rss)).toBeLessThan(1e-10);
        expect(fit.df).toBe(set.df);
      }
    });
  });

  describe('warnings instead of silent numbers', () => {
    it('flags Km and Vmax as poorly determined when the data never bend (all S far below Km)', () => {
      // v = 1000·S/(100 + S) sampled at S = 0.1…0.6: almost a straight line.
      const points = [0.1, 0.2, 0.3, 0.4, 0.5, 0.6].map((s, i) => ({ s, v: ((1000 * s) / (100 + s)) * (1 + 0.02 * (-1) ** i) }));
      const fit = fitMichaelisMenten(points);
      expect(fit.warnings.some((warning) => warning.startsWith('km is poorly determined'))).toBe(true);
      expect(fit.warnings.some((warning) => warning.startsWith('vmax is poorly determined'))).toBe(true);
    });

    it('flags a negative Km and never returns NaN when rates fall with S', () => {
      const points = [1, 2, 3, 4, 5].map((s) => ({ s, v: 10 - s }));
      const fit = fitMichaelisMenten(points);
      expect(fit.parameters.km.value).toBeLessThan(0);
      expect(fit.warnings).toContain(
        `km is not positive (${Number(fit.parameters.km.value.toPrecision(3))}); the model does not describe these data`,
      );
      expect(allNumbers(fit).some(Number.isNaN)).toBe(false);
    });

    it('reports an exact fit with zero-width intervals and no warning', () => {
      const points = [0.5, 1, 2, 4, 8].map((s) => ({ s, v: (3 * s) / (2 + s) }));
      const fit = fitMichaelisMenten(points);
      expect(fit.parameters.vmax.value).toBeCloseTo(3, 10);
      expect(fit.parameters.km.value).toBeCloseTo(2, 10);
      expect(fit.parameters.km.se).toBeLessThan(1e-10);
      expect(fit.warnings).toEqual([]);
    });
  });

  it('does not modify its input', () => {
    const points = deepFreeze(PUROMYCIN.map((point) => ({ ...point })));
    expect(() => fitMichaelisMenten(points, { enzymeConcentration: 1 })).not.toThrow();
  });

  it('treats weights as 1/σ²: scaling all weights changes nothing', () => {
    const weighted = PUROMYCIN.map((point) => ({ ...point, weight: 1 / point.v }));
    const scaled = weighted.map((point) => ({ ...point, weight: point.weight * 1000 }));
    const a = fitMichaelisMenten(weighted);
    const b = fitMichaelisMenten(scaled);
    expect(relativeError(b.parameters.km.value, a.parameters.km.value)).toBeLessThan(1e-10);
    expect(relativeError(b.parameters.km.se, a.parameters.km.se)).toBeLessThan(1e-9);
    expect(relativeError(a.parameters.km.value, 0.06412128168)).toBeGreaterThan(1e-4);
  });

  describe('degenerate input throws KineticsInputError', () => {
    const cases: [string, RatePoint[], string][] = [
      ['two points', [{ s: 1, v: 1 }, { s: 2, v: 2 }], 'fitMichaelisMenten requires at least three points with distinct substrate concentrations'],
      ['all S equal', [{ s: 1, v: 1 }, { s: 1, v: 2 }, { s: 1, v: 3 }], 'fitMichaelisMenten requires at least three points with distinct substrate concentrations'],
      ['two distinct S', [{ s: 1, v: 1 }, { s: 1, v: 2 }, { s: 2, v: 3 }, { s: 2, v: 3 }], 'fitMichaelisMenten requires at least three points with distinct substrate concentrations'],
      ['negative S', [{ s: 1, v: 1 }, { s: -2, v: 2 }, { s: 3, v: 3 }], 'fitMichaelisMenten requires finite, non-negative substrate concentrations (points[1])'],
      ['NaN S', [{ s: Number.NaN, v: 1 }, { s: 2, v: 2 }, { s: 3, v: 3 }], 'fitMichaelisMenten requires finite, non-negative substrate concentrations (points[0])'],
      ['infinite v', [{ s: 1, v: 1 }, { s: 2, v: 2 }, { s: 3, v: Number.POSITIVE_INFINITY }], 'fitMichaelisMenten requires finite rates (points[2])'],
      ['all v zero', [{ s: 1, v: 0 }, { s: 2, v: 0 }, { s: 3, v: 0 }], 'fitMichaelisMenten requires at least one non-zero rate'],
      ['weights on some points', [{ s: 1, v: 1, weight: 1 }, { s: 2, v: 2 }, { s: 3, v: 3, weight: 1 }], 'fitMichaelisMenten requires a weight on every point or on none'],
      ['zero weight', [{ s: 1, v: 1, weight: 1 }, { s: 2, v: 2, weight: 0 }, { s: 3, v: 3, weight: 1 }], 'fitMichaelisMenten requires finite, positive weights (points[1])'],
      ['no points', [], 'fitMichaelisMenten requires at least three points with distinct substrate concentrations'],
    ];
    it.each(cases)('%s', (_label, points, message) => {
      expect(() => fitMichaelisMenten(points)).toThrow(new KineticsInputError(message));
      expect(() => fitMichaelisMenten(points)).toThrow(KineticsInputError);
    });

    it.each([0, -1, Number.NaN, Number.POSITIVE_INFINITY])('enzyme concentration %s', (enzymeConcentration) => {
      expect(() => fitMichaelisMenten(PUROMYCIN, { enzymeConcentration })).toThrow(
        new KineticsInputError('fitMichaelisMenten requires a finite, positive enzyme concentration'),
      );
    });
  });
});
