/** A variant's place in a ranking. */
export type RankedEntry = { variantId: number; rank: number };

/** A change of place; a null rank means outside the top list (or unranked). */
export type RankMove = { variantId: number; previousRank: number | null; rank: number | null };

/**
 * Rank movers between two digests of one campaign, judged on the top lists the readers saw:
 *
 * - **up**: in both top lists, now at a better (smaller) rank;
 * - **down**: in the previous top list and now at a worse rank, or no longer in the top list (its current
 *   rank, if it still has one, from `currentRanks`);
 * - **new**: in the current top list but not in the previous one (`previousRank` null: the previous digest
 *   stored only its top list).
 *
 * Up and new are ordered by current rank, down by previous rank.
 *
 * @param previousTop the previous digest's top list
 * @param currentTop this digest's top list
 * @param currentRanks every variant ranked now (to say where a variant that dropped out stands)
 * @returns the three lists of moves
 * @example
 * rankMovers(
 *   [{ variantId: 1, rank: 1 }, { variantId: 2, rank: 2 }],
 *   [{ variantId: 2, rank: 1 }, { variantId: 3, rank: 2 }],
 *   new Map([[2, 1], [3, 2], [1, 3]]),
 * );
 * // up: 2 (2 → 1); down: 1 (1 → 3); new: 3 (– → 2)
 */
export function rankMovers(
  previousTop: readonly RankedEntry[],
  currentTop: readonly RankedEntry[],
  currentRanks: ReadonlyMap<number, number>,
): { up: RankMove[]; down: RankMove[]; new: RankMove[] } {
  const previousRank = new Map(previousTop.map((entry) => [entry.variantId, entry.rank]));
  const currentRank = new Map(currentTop.map((entry) => [entry.variantId, entry.rank]));
  const up: RankMove[] = [];
  const entered: RankMove[] = [];
  for (const entry of currentTop) {
    const before = previousRank.get(entry.variantId);
    if (before === undefined) entered.push({ variantId: entry.variantId, previousRank: null, rank: entry.rank });
    else if (entry.rank < before) up.push({ variantId: entry.variantId, previousRank: before, rank: entry.rank });
  }
  const down: RankMove[] = [];
  for (const entry of previousTop) {
    const now = currentRank.get(entry.variantId);
    if (now === undefined) down.push({ variantId: entry.variantId, previousRank: entry.rank, rank: currentRanks.get(entry.variantId) ?? null });
    else if (now > entry.rank) down.push({ variantId: entry.variantId, previousRank: entry.rank, rank: now });
  }
  up.sort((first, second) => (first.rank ?? 0) - (second.rank ?? 0));
  entered.sort((first, second) => (first.rank ?? 0) - (second.rank ?? 0));
  down.sort((first, second) => (first.previousRank ?? 0) - (second.previousRank ?? 0));
  return { up, down, new: entered };
}
