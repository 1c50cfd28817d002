import { describe, expect, it } from 'vitest';
import { phProfileInitialEstimate } from '../../../shared/kinetics/ph-profile-initial-estimate';

describe('phProfileInitialEstimate', () => {
  it('reads kmax and the half-maximum crossings off a bell (linear interpolation, by hand)', () => {
    expect(phProfileInitialEstimate([4, 5, 6, 7, 8], [0.2, 0.6, 1, 0.6, 0.2], 'bell')).toEqual([1, 4.75, 7.25]);
  });

  it('works on unsorted input without modifying it', () => {
    const ph = Object.freeze([8, 4, 6, 5, 7]) as number[];
    const k = Object.freeze([0.2, 0.2, 1, 0.6, 0.6]) as number[];
    expect(phProfileInitialEstimate(ph, k, 'bell')).toEqual([1, 4.75, 7.25]);
  });

  it('uses one crossing for a limb, and the end of the range when the limb never halves', () => {
    expect(phProfileInitialEstimate([4, 5, 6, 7], [0.1, 0.5, 0.9, 1], 'acid')).toEqual([1, 5]);
    expect(phProfileInitialEstimate([4, 5, 6, 7], [1, 0.9, 0.8, 0.7], 'base')).toEqual([1, 7]);
  });
});
