/**
 * Review states with their counts.
 *
 * @param counts e.g. { approved: 2, submitted: 1 }
 * @returns e.g. `2 approved, 1 submitted`
 */
export function formatReviewCounts(counts: Partial<Record<string, number>>): string {
  return Object.entries(counts)
    .filter(([, count]) => (count ?? 0) > 0)
    .map(([state, count]) => `${count} ${state}`)
    .join(', ');
}
