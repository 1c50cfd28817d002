import { describe, expect, it } from 'vitest';
import { confidenceBand } from '../../../shared/kinetics/confidence-band';
import { fitMichaelisMenten } from '../../../shared/kinetics/fit-michaelis-menten';
import { fitPhProfile } from '../../../shared/kinetics/fit-ph-profile';
import { fitSubstrateInhibition } from '../../../shared/kinetics/fit-substrate-inhibition';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import { studentTCritical95 } from '../../../shared/kinetics/student-t-critical-95';
import { relativeError } from './test-helpers';

// Puromycin, treated (Bates & Watts 1988), as in fit-michaelis-menten.test.ts.
const PUROMYCIN_S = [0.02, 0.02, 0.06, 0.06, 0.11, 0.11, 0.22, 0.22, 0.56, 0.56, 1.1, 1.1];
const PUROMYCIN_V = [76, 47, 97, 107, 123, 139, 159, 152, 191, 201, 207, 200];
const puromycin = fitMichaelisMenten(PUROMYCIN_S.map((s, i) => ({ s, v: PUROMYCIN_V[i] })));

describe('confidenceBand', () => {
  it('matches a SciPy delta-method band for Puromycin (one-off: curve_fit pcov, stats.t.ppf(0.975, 10))', () => {
    // ŷ and t·√(gᵀ·pcov·g) computed in NumPy from curve_fit's answer at S = 0.05, 0.2 and 1.0 ppm.
    const expected = [
      { x: 0.05, y: 93.18320854434094, halfWidth: 10.79947561825564 },
      { x: 0.2, y: 161.05006147477, halfWidth: 7.885408755927851 },
      { x: 1.0, y: 199.86795359338748, halfWidth: 12.102557004584277 },
    ];
    const band = confidenceBand(puromycin, expected.map((point) => point.x));
    band.forEach((point, i) => {
      expect(point.x).toBe(expected[i].x);
      expect(relativeError(point.y, expected[i].y)).toBeLessThan(1e-8);
      expect(relativeError(point.upper - point.y, expected[i].halfWidth)).toBeLessThan(1e-6);
      expect(point.y - point.lower).toBeCloseTo(point.upper - point.y, 12);
    });
  });

  it('narrows to t·se(Vmax) far above Km, where only Vmax matters', () => {
    const [far] = confidenceBand(puromycin, [1e9]);
    expect(relativeError(far.upper - far.y, studentTCritical95(10) * puromycin.parameters.vmax.se)).toBeLessThan(1e-8);
  });

  it('has zero width at S = 0, where every Michaelis–Menten curve passes through the origin', () => {
    const [origin] = confidenceBand(puromycin, [0]);
    expect(origin).toEqual({ x: 0, y: 0, lower: 0, upper: 0 });
  });

  it('equals t·se(k at optimum) at the pH optimum of a bell (∂k/∂pH = 0 there)', () => {
    const ph = Array.from({ length: 15 }, (_, i) => 3 + i / 2);
    const fit = fitPhProfile(
      ph.map((x, i) => ({ ph: x, k: (1 + 0.03 * Math.sin(5 * i)) / (1 + 10 ** (4.5 - x) + 10 ** (x - 8)) })),
      { model: 'bell' },
    );
    const [atOptimum] = confidenceBand(fit, [fit.phOptimum.value]);
    expect(relativeError(atOptimum.y, fit.kAtOptimum.value)).toBeLessThan(1e-12);
    expect(relativeError(atOptimum.upper - atOptimum.y, studentTCritical95(fit.df) * fit.kAtOptimum.se)).toBeLessThan(1e-9);
  });

  it('maps the substrate-inhibition gradient to Ki consistently with a finite-difference delta method', () => {
    const s = [0.25, 0.5, 1, 2, 4, 8, 16, 32];
    const fit = fitSubstrateInhibition(s.map((x, i) => ({ s: x, v: ((10 * x) / (1 + x + (x * x) / 8)) * (1 + 0.03 * Math.cos(2 * i)) })));
    const at = 5;
    const [point] = confidenceBand(fit, [at]);
    const values = fit.fittedParameters.map((name) => fit.parameters[name].value);
    const rate = (p: number[]) => (p[0] * at) / (p[1] + at + (at * at) / p[2]);
    const gradient = values.map((value, j) => {
      const h = 1e-6 * Math.abs(value);
      const up = values.slice();
      const down = values.slice();
      up[j] += h;
      down[j] -= h;
      return (rate(up) - rate(down)) / (2 * h);
    });
    let variance = 0;
    for (let j = 0; j < 3; j += 1) for (let k = 0; k < 3; k += 1) variance += gradient[j] * gradient[k] * fit.covariance[j][k];
    expect(relativeError(point.upper - point.y, studentTCritical95(fit.df) * Math.sqrt(variance))).toBeLessThan(1e-6);
  });

  it('throws KineticsInputError when there is no band to draw or the x values are bad', () => {
    const singular = fitMichaelisMenten([1, 2, 3, 4, 5].map((s) => ({ s, v: 0.01 * (-1) ** s })));
    expect(singular.warnings[0]).toMatch(/^JᵀJ is singular/);
    expect(() => confidenceBand(singular, [1])).toThrow(new KineticsInputError('confidenceBand requires a fit with a finite covariance'));
    expect(() => confidenceBand(puromycin, [-1])).toThrow(
      new KineticsInputError('confidenceBand requires finite, non-negative substrate concentrations'),
    );
    const ph = fitPhProfile([4, 5, 6, 7].map((x) => ({ ph: x, k: 1 / (1 + 10 ** (5 - x)) })), { model: 'acid' });
    expect(() => confidenceBand(ph, [Number.NaN])).toThrow(new KineticsInputError('confidenceBand requires finite pH values'));
  });
});
