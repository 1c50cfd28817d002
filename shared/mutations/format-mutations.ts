import { aminoAcidFromOneLetter, type AminoAcid } from '../sequence/amino-acids';

/** One amino-acid substitution on a parent sequence. */
export interface Mutation {
  /** 1-based residue number in the parent sequence. */
  readonly position: number;
  /** Parent residue, one-letter upper case (`C`). */
  readonly from: string;
  /** New residue, one-letter upper case (`A`), or `*` for a stop. */
  readonly to: string;
}

/** Label of the empty mutation set: the parent itself. */
export const parentLabel = 'parent';

/** HGVS description of a protein without change, `p.=` (HGVS protein recommendations, "no change"). */
export const parentHgvs = 'p.=';

/**
 * One-letter shorthand of one substitution, the form used in papers and in the canonical label.
 *
 * @param mutation a substitution with one-letter residues
 * @returns e.g. `C112A`; a stop is `*` (`W24*`)
 * @throws {Error} when a residue is not a one-letter standard amino acid (or `*` as the new residue)
 * @example formatMutation({ position: 112, from: 'C', to: 'A' }) // 'C112A'
 */
export function formatMutation(mutation: Mutation): string {
  const { from, to } = residuesOf(mutation, 'formatMutation');
  return `${from.oneLetter}${mutation.position}${to.oneLetter}`;
}

/**
 * Canonical label of a mutation set: substitutions by ascending position, one-letter shorthand,
 * joined with `/`; the empty set is {@link parentLabel}.
 *
 * @param mutations the set, in any order (not modified)
 * @returns e.g. `C112A/H190N`
 * @throws {Error} when two substitutions share a position, a position is not a whole number from 1,
 *   or a residue is not a standard one-letter code
 * @example
 * formatMutationLabel([{ position: 190, from: 'H', to: 'N' }, { position: 112, from: 'C', to: 'A' }]) // 'C112A/H190N'
 */
export function formatMutationLabel(mutations: readonly Mutation[]): string {
  const sorted = sortedByPosition(mutations, 'formatMutationLabel');
  if (sorted.length === 0) return parentLabel;
  return sorted.map(formatMutation).join('/');
}

/**
 * HGVS protein description of a mutation set, with three-letter residues and `Ter` for a stop:
 * `p.Cys112Ala` for one substitution, `p.[Cys112Ala;His190Asn]` for several on one chain
 * (hgvs-nomenclature.org, "Protein: substitution" and "Alleles"), `p.=` for none. No reference
 * sequence identifier is prefixed: the parent enzyme is the reference.
 *
 * @param mutations the set, in any order (not modified)
 * @returns the description
 * @throws {Error} as {@link formatMutationLabel}
 * @example formatMutationHgvs([{ position: 24, from: 'W', to: '*' }]) // 'p.Trp24Ter'
 */
export function formatMutationHgvs(mutations: readonly Mutation[]): string {
  const sorted = sortedByPosition(mutations, 'formatMutationHgvs');
  if (sorted.length === 0) return parentHgvs;
  const changes = sorted.map((mutation) => {
    const { from, to } = residuesOf(mutation, 'formatMutationHgvs');
    return `${from.threeLetter}${mutation.position}${to.threeLetter}`;
  });
  return changes.length === 1 ? `p.${changes[0]}` : `p.[${changes.join(';')}]`;
}

/**
 * Key under which a mutation set is unique on its parent: two inputs describing the same set in
 * different notations or orders get the same key. It is the canonical label; it has its own name so
 * that uniqueness checks say what they rely on.
 *
 * @param mutations the set, in any order (not modified)
 * @returns e.g. `C112A/H190N`, or `parent` for the empty set
 * @throws {Error} as {@link formatMutationLabel}
 * @example
 * mutationKey([{ position: 190, from: 'H', to: 'N' }, { position: 112, from: 'C', to: 'A' }]) // 'C112A/H190N'
 */
export function mutationKey(mutations: readonly Mutation[]): string {
  return formatMutationLabel(mutations);
}

function residuesOf(mutation: Mutation, caller: string): { from: AminoAcid; to: AminoAcid } {
  const from = aminoAcidFromOneLetter(mutation.from);
  const to = aminoAcidFromOneLetter(mutation.to);
  if (from === undefined || from.oneLetter === '*') {
    throw new Error(`${caller} requires a standard one-letter parent residue, got '${mutation.from}'`);
  }
  if (to === undefined) {
    throw new Error(`${caller} requires a standard one-letter new residue or '*', got '${mutation.to}'`);
  }
  return { from, to };
}

function sortedByPosition(mutations: readonly Mutation[], caller: string): Mutation[] {
  const misplaced = mutations.find((mutation) => !Number.isSafeInteger(mutation.position) || mutation.position < 1);
  if (misplaced !== undefined) {
    throw new Error(`${caller} requires positions that are whole numbers from 1, got ${misplaced.position}`);
  }
  const sorted = [...mutations].sort((left, right) => left.position - right.position);
  for (let index = 1; index < sorted.length; index += 1) {
    if (sorted[index].position === sorted[index - 1].position) {
      throw new Error(`${caller} requires one substitution per position, got two at ${sorted[index].position}`);
    }
  }
  return sorted;
}
