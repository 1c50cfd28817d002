/** One residue type: its IUPAC-IUB one-letter and three-letter symbols and its name. */
export interface AminoAcid {
  /** One-letter symbol, upper case (`C`); `*` for the stop. */
  readonly oneLetter: string;
  /** Three-letter symbol, capitalised (`Cys`); `Ter` for the stop. */
  readonly threeLetter: string;
  /** Trivial name (`cysteine`). */
  readonly name: string;
}

/**
 * The 20 standard (genetically encoded) amino acids, in alphabetical order of their names.
 *
 * Symbols follow the IUPAC-IUB Joint Commission on Biochemical Nomenclature, "Nomenclature and
 * symbolism for amino acids and peptides" (Recommendations 1983), Eur. J. Biochem. 138:9-37 (1984),
 * section 3AA-1, which are also the symbols the HGVS recommendations use for protein changes.
 * Selenocysteine (U, Sec), pyrrolysine (O, Pyl) and the ambiguity symbols (B, Z, J, X) are left out
 * on purpose: every position of a registered enzyme must be one definite standard residue.
 */
export const standardAminoAcids: readonly AminoAcid[] = [
  { oneLetter: 'A', threeLetter: 'Ala', name: 'alanine' },
  { oneLetter: 'R', threeLetter: 'Arg', name: 'arginine' },
  { oneLetter: 'N', threeLetter: 'Asn', name: 'asparagine' },
  { oneLetter: 'D', threeLetter: 'Asp', name: 'aspartic acid' },
  { oneLetter: 'C', threeLetter: 'Cys', name: 'cysteine' },
  { oneLetter: 'E', threeLetter: 'Glu', name: 'glutamic acid' },
  { oneLetter: 'Q', threeLetter: 'Gln', name: 'glutamine' },
  { oneLetter: 'G', threeLetter: 'Gly', name: 'glycine' },
  { oneLetter: 'H', threeLetter: 'His', name: 'histidine' },
  { oneLetter: 'I', threeLetter: 'Ile', name: 'isoleucine' },
  { oneLetter: 'L', threeLetter: 'Leu', name: 'leucine' },
  { oneLetter: 'K', threeLetter: 'Lys', name: 'lysine' },
  { oneLetter: 'M', threeLetter: 'Met', name: 'methionine' },
  { oneLetter: 'F', threeLetter: 'Phe', name: 'phenylalanine' },
  { oneLetter: 'P', threeLetter: 'Pro', name: 'proline' },
  { oneLetter: 'S', threeLetter: 'Ser', name: 'serine' },
  { oneLetter: 'T', threeLetter: 'Thr', name: 'threonine' },
  { oneLetter: 'W', threeLetter: 'Trp', name: 'tryptophan' },
  { oneLetter: 'Y', threeLetter: 'Tyr', name: 'tyrosine' },
  { oneLetter: 'V', threeLetter: 'Val', name: 'valine' },
];

/**
 * Translation termination (stop). HGVS writes it `Ter` in three-letter descriptions and `*` in
 * one-letter ones (hgvs-nomenclature.org, "Protein: substitution": p.Trp24Ter, p.Trp24*).
 */
export const stopResidue: AminoAcid = { oneLetter: '*', threeLetter: 'Ter', name: 'stop (translation termination)' };

const byOneLetter = new Map<string, AminoAcid>(
  [...standardAminoAcids, stopResidue].map((aminoAcid) => [aminoAcid.oneLetter, aminoAcid]),
);

// Keyed in upper case so `cys`, `CYS` and `Cys` all resolve: spreadsheets and hand-typed lists
// rarely keep the conventional capitalisation.
const byThreeLetter = new Map<string, AminoAcid>(
  [...standardAminoAcids, stopResidue].map((aminoAcid) => [aminoAcid.threeLetter.toUpperCase(), aminoAcid]),
);

/**
 * Looks up a residue by its one-letter symbol, ignoring case (sequences are often pasted in lower
 * case). `*` is the stop.
 *
 * @param symbol one character, e.g. `C` or `c`
 * @returns the residue, or `undefined` when the symbol is not one of the 20 standard amino acids or `*`
 * @example aminoAcidFromOneLetter('c')?.threeLetter // 'Cys'
 */
export function aminoAcidFromOneLetter(symbol: string): AminoAcid | undefined {
  return byOneLetter.get(symbol.toUpperCase());
}

/**
 * Looks up a residue by its three-letter symbol, ignoring case. `Ter` is the stop.
 *
 * @param symbol three letters, e.g. `Cys`, `cys` or `CYS`
 * @returns the residue, or `undefined` when the symbol is not a standard amino acid or `Ter`
 * @example aminoAcidFromThreeLetter('CYS')?.oneLetter // 'C'
 */
export function aminoAcidFromThreeLetter(symbol: string): AminoAcid | undefined {
  return byThreeLetter.get(symbol.toUpperCase());
}

/**
 * Looks up a residue by either symbol: one character is read as a one-letter symbol, three as a
 * three-letter symbol, anything else finds nothing.
 *
 * @param symbol `C`, `Cys`, `*` or `Ter` in any case
 * @returns the residue, or `undefined`
 * @example aminoAcidFromSymbol('Ter') === stopResidue // true
 */
export function aminoAcidFromSymbol(symbol: string): AminoAcid | undefined {
  if (symbol.length === 1) return aminoAcidFromOneLetter(symbol);
  if (symbol.length === 3) return aminoAcidFromThreeLetter(symbol);
  return undefined;
}
