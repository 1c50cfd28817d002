import { describe, expect, it } from 'vitest';
import { michaelisMentenInitialEstimate } from '../../../shared/kinetics/michaelis-menten-initial-estimate';

describe('michaelisMentenInitialEstimate', () => {
  it('is exact for noise-free data through the Hanes–Woolf line S/v = Km/Vmax + S/Vmax', () => {
    const [vmax, km] = michaelisMentenInitialEstimate([1, 2, 4], [10 / 3, 5, 20 / 3]);
    expect(vmax).toBeCloseTo(10, 12);
    expect(km).toBeCloseTo(2, 12);
  });

  it('ignores points with S = 0 or v ≤ 0, which the linear forms cannot use', () => {
    const [vmax, km] = michaelisMentenInitialEstimate([0, 1, 2, 4, 8], [-0.1, 10 / 3, 5, 20 / 3, 8]);
    expect(vmax).toBeCloseTo(10, 12);
    expect(km).toBeCloseTo(2, 12);
  });

  it('falls back to Eadie–Hofstee when the Hanes–Woolf intercept is not positive', () => {
    // Saturated, noisy data: S/v has a slightly negative intercept; v against v/S still slopes down.
    const [vmax, km] = michaelisMentenInitialEstimate([1, 2, 4, 8], [10, 10, 10.2, 9.9]);
    expect(vmax).toBeCloseTo(10.033749353556725, 10);
    expect(km).toBeCloseTo(0.0018628031524629317, 12);
  });

  it('falls back to the largest rate and the S nearest its half when neither line is usable', () => {
    // v = S² rises faster than any hyperbola.
    expect(michaelisMentenInitialEstimate([1, 2, 3, 4], [1, 4, 9, 16])).toEqual([16, 3]);
  });
});
