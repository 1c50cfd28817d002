import { describe, expect, it } from 'vitest';
import { hillInitialEstimate } from '../../../shared/kinetics/hill-initial-estimate';

describe('hillInitialEstimate', () => {
  it('starts Vmax at 1.05 × the largest rate and reads n and K½ off the Hill plot', () => {
    // v = 2, 5, 8 at S = 1, 2, 4: ln(v/(8.4 − v)) against ln S has slope ln(20·6.4/2)/ln 4 = 3.0 (by hand).
    const [vmax, khalf, n] = hillInitialEstimate([1, 2, 4], [2, 5, 8]);
    expect(vmax).toBeCloseTo(8.4, 12);
    expect(n).toBeCloseTo(3, 10);
    expect(khalf).toBeCloseTo(1.5631071937858203, 10);
  });

  it('starts at n = 1 with the Michaelis–Menten K when the Hill plot is unusable', () => {
    // Rates that fall with S give a negative Hill-plot slope.
    const [, , n] = hillInitialEstimate([1, 2, 4, 8], [8, 6, 4, 2]);
    expect(n).toBe(1);
  });

  it('starts at n = 1 when no rate is positive', () => {
    const [vmax, , n] = hillInitialEstimate([1, 2, 4, 8], [-1, -2, -3, -3.5]);
    expect(n).toBe(1);
    expect(vmax).toBe(-3.5);
  });
});
