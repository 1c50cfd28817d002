import { describe, expect, it } from 'vitest';
import { rankVariants } from '@shared/digest/rank-variants';

// Plumbing of the ranking on invented numbers; the ΔΔG‡ values themselves are checked against hand
// computation in tests/server/digests.test.ts.
const entry = (variantId: number, label: string, value: number, se: number) => ({ variantId, label, ddgKjPerMol: { value, se } });

describe('rankVariants', () => {
  it('puts the most negative ΔΔG‡ (fastest relative to the parent) first, ranks without gaps', () => {
    const ranked = rankVariants([entry(1, 'A1G', 1.2, 0.2), entry(2, 'C2S', -2.8, 0.2), entry(3, 'D3N', -0.4, 0.3)]);
    expect(ranked.map((item) => [item.rank, item.label])).toEqual([
      [1, 'C2S'],
      [2, 'D3N'],
      [3, 'A1G'],
    ]);
  });

  it('breaks ties by the smaller standard error, then by label, whatever the input order', () => {
    const input = [entry(1, 'B', -1, 0.3), entry(2, 'A', -1, 0.3), entry(3, 'C', -1, 0.1)];
    expect(rankVariants(input).map((item) => item.label)).toEqual(['C', 'A', 'B']);
    expect(rankVariants([...input].reverse()).map((item) => item.label)).toEqual(['C', 'A', 'B']);
  });

  it('says whether ΔΔG‡ is outside 1.96 standard errors of zero (common practice for a two-sided 95 % interval)', () => {
    const [clear, within] = rankVariants([entry(1, 'A', -0.4, 0.2), entry(2, 'B', -0.39, 0.2)]);
    expect(clear.clearOfParent).toBe(true); // 0.4 ≥ 1.96 × 0.2 = 0.392
    expect(within.clearOfParent).toBe(false); // 0.39 < 0.392
  });

  it('does not modify its input and refuses non-finite values', () => {
    const input = [entry(1, 'B', 1, 0.1), entry(2, 'A', -1, 0.1)];
    rankVariants(input);
    expect(input.map((item) => item.label)).toEqual(['B', 'A']);
    expect(() => rankVariants([entry(1, 'A', Number.NaN, 0.1)])).toThrow(/finite ΔΔG‡/);
    expect(() => rankVariants([entry(1, 'A', 1, -0.1)])).toThrow(/non-negative SE/);
    expect(rankVariants([])).toEqual([]);
  });
});
