import { aminoAcidFromOneLetter } from './amino-acids';

/**
 * Longest sequence accepted, in residues. Generous for enzymes (most catalytic chains are under
 * 2,000 residues; the largest known single chains are about 35,000) and small enough that a
 * mistaken upload of a genome or a binary file is refused instead of stored.
 */
export const maxSequenceResidues = 50_000;

/** Where a one-letter sequence first departs from the 20 standard amino acids, and why. */
export interface InvalidResidue {
  /** 1-based residue number. */
  readonly position: number;
  /** The character as written. */
  readonly letter: string;
  /** Why it is refused, e.g. `an unspecified amino acid`. */
  readonly reason: string;
}

export type SequenceCheck =
  | { readonly ok: true; readonly sequence: string }
  | { readonly ok: false; readonly message: string };

const EVERY_POSITION = 'every position must be one of the 20 standard amino acids';

// Symbols that are letters of some amino-acid alphabet, explained so a refusal says what to do
// instead of only "not allowed". Ambiguity codes are refused because mutation positions, catalytic
// sites and reference residues must all be checkable against one definite residue.
const KNOWN_NON_STANDARD: ReadonlyMap<string, string> = new Map([
  ['X', `an unspecified amino acid (X); ${EVERY_POSITION}`],
  ['B', `ambiguous (B, Asp or Asn); ${EVERY_POSITION}`],
  ['Z', `ambiguous (Z, Glu or Gln); ${EVERY_POSITION}`],
  ['J', `ambiguous (J, Leu or Ile); ${EVERY_POSITION}`],
  ['U', `selenocysteine (U), which is not supported; ${EVERY_POSITION}`],
  ['O', `pyrrolysine (O), which is not supported; ${EVERY_POSITION}`],
  ['*', 'a stop inside the sequence; only a final stop is allowed'],
  ['-', 'an alignment gap; paste the ungapped sequence'],
  ['.', 'an alignment gap; paste the ungapped sequence'],
]);

/**
 * Finds the first residue of a one-letter sequence that is not one of the 20 standard amino acids.
 * Case is ignored. The alphabet is that of IUPAC-IUB (Eur. J. Biochem. 138:9-37, 1984, 3AA-1);
 * X, B, Z, J, U, O, `*`, `-` and `.` are refused with a reason of their own.
 *
 * @param sequence one-letter residues with nothing else (no whitespace, digits or header)
 * @returns the first offending residue, or `undefined` when every residue is standard
 * @example findInvalidResidue('MKVX')
 * // { position: 4, letter: 'X',
 * //   reason: 'an unspecified amino acid (X); every position must be one of the 20 standard amino acids' }
 */
export function findInvalidResidue(sequence: string): InvalidResidue | undefined {
  for (let index = 0; index < sequence.length; index += 1) {
    const letter = sequence[index];
    const standard = aminoAcidFromOneLetter(letter);
    if (standard !== undefined && standard.oneLetter !== '*') continue;
    const reason =
      KNOWN_NON_STANDARD.get(letter.toUpperCase()) ?? `not an amino-acid letter; ${EVERY_POSITION}`;
    return { position: index + 1, letter, reason };
  }
  return undefined;
}

/**
 * Validates a one-letter amino-acid sequence: not empty, at most {@link maxSequenceResidues}
 * residues, and every residue one of the 20 standard amino acids (see {@link findInvalidResidue}).
 * Lower case is accepted and returned in upper case, the form stored and compared.
 *
 * Pasted text with whitespace, line numbers, a header or a final `*` goes through `parseFasta`
 * first; this function is the strict check underneath.
 *
 * @param sequence one-letter residues
 * @returns `{ ok: true, sequence }` in upper case, or `{ ok: false, message }`
 * @example validateSequence('mkvl') // { ok: true, sequence: 'MKVL' }
 * @example validateSequence('MKBL').ok // false: "residue 3 is 'B': ambiguous (B, Asp or Asn); ..."
 */
export function validateSequence(sequence: string): SequenceCheck {
  if (sequence.length === 0) return { ok: false, message: 'the sequence is empty' };
  if (sequence.length > maxSequenceResidues) {
    return {
      ok: false,
      message: `the sequence has ${sequence.length} residues; at most ${maxSequenceResidues} are accepted`,
    };
  }
  const invalid = findInvalidResidue(sequence);
  if (invalid !== undefined) {
    return { ok: false, message: `residue ${invalid.position} is '${invalid.letter}': ${invalid.reason}` };
  }
  return { ok: true, sequence: sequence.toUpperCase() };
}
