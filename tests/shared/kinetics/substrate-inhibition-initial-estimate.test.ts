import { describe, expect, it } from 'vitest';
import { substrateInhibitionInitialEstimate } from '../../../shared/kinetics/substrate-inhibition-initial-estimate';

describe('substrateInhibitionInitialEstimate', () => {
  it('is exact for noise-free data: S/v = Km/Vmax + S/Vmax + S²/(Vmax·Ki) is a parabola in S', () => {
    const s = [0.5, 1, 2, 4, 8];
    const [vmax, km, inverseKi] = substrateInhibitionInitialEstimate(s, s.map((x) => (10 * x) / (1 + x + (x * x) / 4)));
    expect(vmax).toBeCloseTo(10, 10);
    expect(km).toBeCloseTo(1, 10);
    expect(inverseKi).toBeCloseTo(0.25, 10);
  });

  it('starts without inhibition (1/Ki = 0) when the parabola bends the wrong way', () => {
    // Michaelis–Menten data with an upward bias at high S: the quadratic coefficient is negative.
    const s = [0.5, 1, 2, 4, 8];
    const [, , inverseKi] = substrateInhibitionInitialEstimate(s, s.map((x) => ((10 * x) / (1 + x)) * (1 + 0.01 * x)));
    expect(inverseKi).toBe(0);
  });

  it('falls back to the Michaelis–Menten start with fewer than three usable concentrations', () => {
    expect(substrateInhibitionInitialEstimate([0, 1, 2, 2], [0, 10 / 3, 5, 5])).toEqual([
      expect.closeTo(10, 10),
      expect.closeTo(2, 10),
      0,
    ]);
  });
});
