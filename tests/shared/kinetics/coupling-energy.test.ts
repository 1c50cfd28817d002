import { describe, expect, it } from 'vitest';
import { couplingEnergy } from '../../../shared/kinetics/coupling-energy';
import { deltaDeltaGActivation } from '../../../shared/kinetics/delta-delta-g';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';

const RT_LN10_KJ_298 = (8.31446261815324 * 298.15 * Math.LN10) / 1000;
const exact = (value: number) => ({ value, se: 0 });

describe('couplingEnergy', () => {
  it('is zero when the two mutations are additive (each tenfold, the double hundredfold slower)', () => {
    const result = couplingEnergy({ parent: exact(100), a: exact(10), b: exact(10), ab: exact(1) }, 298.15);
    expect(result.kJPerMol.value).toBeCloseTo(0, 12);
  });

  it('is −RT·ln 10 when the double mutant is no slower than either single (double-mutant cycle algebra)', () => {
    const result = couplingEnergy({ parent: exact(100), a: exact(10), b: exact(10), ab: exact(10) }, 298.15);
    expect(result.kJPerMol.value).toBeCloseTo(-RT_LN10_KJ_298, 12);
    expect(result.kcalPerMol.value).toBeCloseTo(-RT_LN10_KJ_298 / 4.184, 12);
  });

  it('equals ΔΔG‡(AB) − ΔΔG‡(A) − ΔΔG‡(B) for arbitrary rates', () => {
    const rates = { parent: exact(7.3e5), a: exact(2.1e4), b: exact(3.9e5), ab: exact(1.7e3) };
    const single = (variant: { value: number; se: number }) => deltaDeltaGActivation(variant, rates.parent, 303.15).kJPerMol.value;
    const expected = single(rates.ab) - single(rates.a) - single(rates.b);
    expect(couplingEnergy(rates, 303.15).kJPerMol.value).toBeCloseTo(expected, 12);
  });

  it('counts the parent’s error once: se = RT·√(Σ (se/k)²) over the four rate constants', () => {
    const tenPercent = (value: number) => ({ value, se: value / 10 });
    const result = couplingEnergy({ parent: tenPercent(100), a: tenPercent(10), b: tenPercent(10), ab: tenPercent(10) }, 298.15);
    const rt = (8.31446261815324 * 298.15) / 1000;
    expect(result.kJPerMol.se).toBeCloseTo(rt * Math.sqrt(4 * 0.01), 12);
    // Adding the three ΔΔG‡ errors in quadrature would count the parent three times: √(6·0.01).
    expect(result.kJPerMol.se).not.toBeCloseTo(rt * Math.sqrt(6 * 0.01), 3);
  });

  it('throws KineticsInputError naming the bad argument', () => {
    expect(() => couplingEnergy({ parent: exact(1), a: exact(1), b: exact(-1), ab: exact(1) }, 298.15)).toThrow(
      new KineticsInputError('couplingEnergy requires a finite, positive rate constant (b)'),
    );
    expect(() => couplingEnergy({ parent: exact(1), a: exact(1), b: exact(1), ab: { value: 1, se: Number.NaN } }, 298.15)).toThrow(
      new KineticsInputError('couplingEnergy requires a finite, non-negative standard error (ab)'),
    );
    expect(() => couplingEnergy({ parent: exact(1), a: exact(1), b: exact(1), ab: exact(1) }, -1)).toThrow(
      new KineticsInputError('couplingEnergy requires a finite, positive temperature in kelvin'),
    );
  });
});
