import { describe, expect, it } from 'vitest';
import { rankMovers } from '@shared/digest/rank-movers';

// Plumbing of the movers on invented rankings.
describe('rankMovers', () => {
  it('finds up, down (also out of the list) and new', () => {
    const previous = [
      { variantId: 1, rank: 1 },
      { variantId: 2, rank: 2 },
      { variantId: 3, rank: 3 },
    ];
    const current = [
      { variantId: 1, rank: 1 },
      { variantId: 3, rank: 2 },
      { variantId: 4, rank: 3 },
    ];
    expect(rankMovers(previous, current, new Map([[1, 1], [3, 2], [4, 3], [2, 5]]))).toEqual({
      up: [{ variantId: 3, previousRank: 3, rank: 2 }],
      down: [{ variantId: 2, previousRank: 2, rank: 5 }],
      new: [{ variantId: 4, previousRank: null, rank: 3 }],
    });
  });

  it('reports a variant that is no longer ranked at all with a null rank', () => {
    expect(rankMovers([{ variantId: 7, rank: 1 }], [], new Map()).down).toEqual([{ variantId: 7, previousRank: 1, rank: null }]);
  });

  it('reports nothing when the top list is unchanged, and everything new after an empty one', () => {
    const top = [{ variantId: 1, rank: 1 }, { variantId: 2, rank: 2 }];
    expect(rankMovers(top, top, new Map([[1, 1], [2, 2]]))).toEqual({ up: [], down: [], new: [] });
    expect(rankMovers([], top, new Map()).new.map((move) => move.variantId)).toEqual([1, 2]);
  });

  it('orders up and new by the current rank and down by the previous rank', () => {
    const previous = [1, 2, 3, 4].map((variantId) => ({ variantId, rank: variantId }));
    const current = [
      { variantId: 4, rank: 1 },
      { variantId: 6, rank: 2 },
      { variantId: 3, rank: 3 },
      { variantId: 5, rank: 4 },
    ];
    const moves = rankMovers(previous, current, new Map([[1, 6], [2, 7]]));
    expect(moves.up.map((move) => move.variantId)).toEqual([4]);
    expect(moves.new.map((move) => move.variantId)).toEqual([6, 5]);
    expect(moves.down.map((move) => move.variantId)).toEqual([1, 2]);
  });
});
