/** A variant with its ΔΔG‡ for kcat/Km against the matched parent, kJ/mol. */
export type RankCandidate = { variantId: number; label: string; ddgKjPerMol: { value: number; se: number } };

/** Two-sided 95 % quantile of the standard normal distribution (common practice for "outside the error"). */
const Z_95 = 1.959963984540054;

/**
 * Ranks variants by ΔΔG‡ for kcat/Km against the condition-matched parent, most negative first (the most
 * improved transition-state stabilisation relative to free enzyme and substrate). Ties in ΔΔG‡ go to the
 * smaller standard error, then to the label, so the order never depends on the input order. Ranks are
 * 1, 2, 3, … without gaps. Each entry also says whether |ΔΔG‡| ≥ 1.96 SE, i.e. whether the difference from
 * the parent lies outside its 95 % normal interval.
 *
 * Reference: ΔΔG‡ = −RT ln(k_variant/k_parent), negative for a faster variant (Fersht, Structure and
 * Mechanism in Protein Science, 1999, ch. 15); the 1.96 quantile is common practice.
 *
 * @param candidates variants with ΔΔG‡ ± SE in kJ/mol; never modified
 * @throws {Error} for a ΔΔG‡ or SE that is not a finite number (SE must be ≥ 0)
 * @returns the candidates in rank order with `rank` and `clearOfParent`
 * @example
 * rankVariants([
 *   { variantId: 1, label: 'A1G', ddgKjPerMol: { value: 1.2, se: 0.2 } },
 *   { variantId: 2, label: 'C2S', ddgKjPerMol: { value: -2.8, se: 0.2 } },
 * ]).map((entry) => entry.rank + entry.label); // ['1C2S', '2A1G']
 */
export function rankVariants<T extends RankCandidate>(candidates: readonly T[]): (T & { rank: number; clearOfParent: boolean })[] {
  for (const candidate of candidates) {
    const { value, se } = candidate.ddgKjPerMol;
    if (!Number.isFinite(value) || !Number.isFinite(se) || se < 0) {
      throw new Error(`rankVariants requires a finite ΔΔG‡ and a finite, non-negative SE (variant ${candidate.variantId})`);
    }
  }
  return [...candidates]
    .sort(
      (first, second) =>
        first.ddgKjPerMol.value - second.ddgKjPerMol.value ||
        first.ddgKjPerMol.se - second.ddgKjPerMol.se ||
        (first.label < second.label ? -1 : first.label > second.label ? 1 : first.variantId - second.variantId),
    )
    .map((candidate, index) => ({
      ...candidate,
      rank: index + 1,
      clearOfParent: Math.abs(candidate.ddgKjPerMol.value) >= Z_95 * candidate.ddgKjPerMol.se,
    }));
}
