import { describe, expect, it } from 'vitest';
import { deltaMethodEstimate } from '../../../shared/kinetics/delta-method-estimate';
import { studentTCritical95 } from '../../../shared/kinetics/student-t-critical-95';

describe('deltaMethodEstimate', () => {
  it('uses the full covariance: var(θ₁ − θ₂) = 4 + 1 − 2·1 = 3 (by hand)', () => {
    const estimate = deltaMethodEstimate(0, [1, -1], [[4, 1], [1, 1]], 10);
    expect(estimate.se).toBeCloseTo(Math.sqrt(3), 15);
    expect(estimate.ci95[1]).toBeCloseTo(studentTCritical95(10) * Math.sqrt(3), 14);
    expect(estimate.ci95[0]).toBeCloseTo(-estimate.ci95[1], 14);
  });

  it('reports an infinite error and an unbounded interval when the covariance is unknown', () => {
    expect(deltaMethodEstimate(2, [1, 0], null, 5)).toEqual({
      value: 2,
      se: Number.POSITIVE_INFINITY,
      ci95: [Number.NEGATIVE_INFINITY, Number.POSITIVE_INFINITY],
    });
  });

  it('keeps a finite error when only an unrelated parameter has an infinite variance (no 0·∞ = NaN)', () => {
    const covariance = [[4, Number.POSITIVE_INFINITY], [Number.POSITIVE_INFINITY, Number.POSITIVE_INFINITY]];
    expect(deltaMethodEstimate(1, [1, 0], covariance, 5).se).toBe(2);
  });
});
