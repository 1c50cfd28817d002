import { describe, expect, it } from 'vitest';
import { fitStraightLine } from '../../../shared/kinetics/fit-straight-line';

describe('fitStraightLine', () => {
  it('fits y = 1 + 2x exactly', () => {
    expect(fitStraightLine([0, 1, 2], [1, 3, 5])).toEqual({ slope: 2, intercept: 1 });
  });

  it('gives the least-squares line through scattered points (by hand: slope 0.76, intercept 0.31)', () => {
    // x̄ = 1.5, ȳ = 1.45; Sxx = 5, Sxy = 3.8; slope = Sxy/Sxx, intercept = ȳ − slope·x̄.
    const line = fitStraightLine([0, 1, 2, 3], [0.5, 0.9, 1.6, 2.8])!;
    expect(line.slope).toBeCloseTo(0.76, 12);
    expect(line.intercept).toBeCloseTo(0.31, 12);
  });

  it('keeps its digits far from the origin (centred sums)', () => {
    const line = fitStraightLine([1e8, 1e8 + 1, 1e8 + 2], [3, 5, 7])!;
    expect(line.slope).toBeCloseTo(2, 8);
  });

  it('returns null with fewer than two distinct x', () => {
    expect(fitStraightLine([1], [1])).toBeNull();
    expect(fitStraightLine([2, 2, 2], [1, 2, 3])).toBeNull();
  });
});
