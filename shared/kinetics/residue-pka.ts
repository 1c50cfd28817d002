import { KineticsInputError } from './kinetics-input-error';

/**
 * Side-chain pKa values of free amino acids at 25 °C, by one-letter code (Dawson, Elliott, Elliott &
 * Jones, Data for Biochemical Research, 3rd ed., Oxford 1986). Inside a protein these shift with the
 * environment, which is what a fitted pKa beside them shows.
 */
export const FREE_RESIDUE_PKA: Readonly<Record<string, number>> = {
  D: 3.9,
  E: 4.07,
  H: 6.04,
  C: 8.37,
  Y: 10.46,
  K: 10.54,
  R: 12.48,
};

/** An annotated residue: sequence position (1-based) and one-letter code; other fields pass through. */
export type AnnotatedResidue = { position: number; residue: string };

/** One fitted pKa with the ionizable annotated residues that might own it, nearest free-residue pKa first. */
export type PkaAssignment<T extends AnnotatedResidue> = {
  pKa: number;
  candidates: (T & { freePka: number; shift: number })[];
};

/**
 * Candidate residues for fitted pKa values: for each fitted pKa, every annotated residue with an ionizable
 * side chain (Asp, Glu, His, Cys, Tyr, Lys, Arg), its free-residue pKa and the shift, fitted − free, in pH
 * units, ordered by the size of the shift. Residues without an ionizable side chain are not candidates.
 * The assignment itself is the scientist's: a pH profile says that a group ionizes, not which.
 *
 * Reference: Dawson et al., Data for Biochemical Research, 3rd ed. (1986) (free-residue pKa values);
 * Fersht, Structure and Mechanism in Protein Science (1999) (pKa shifts in active sites).
 *
 * @param fittedPkas fitted pKa values, pH units
 * @param residues annotated residues with 1-based `position` and one-letter `residue` (either case)
 * @throws {KineticsInputError} a fitted pKa that is not finite, or a position that is not a positive
 *   integer
 * @returns one assignment per fitted pKa, in input order
 * @example
 * matchResiduePkas([6.5], [{ position: 57, residue: 'H' }, { position: 195, residue: 'S' }])[0].candidates;
 * // [{ position: 57, residue: 'H', freePka: 6.04, shift: 0.46 (to rounding) }]
 */
export function matchResiduePkas<T extends AnnotatedResidue>(
  fittedPkas: readonly number[],
  residues: readonly T[],
): PkaAssignment<T>[] {
  for (const pKa of fittedPkas) {
    if (!Number.isFinite(pKa)) throw new KineticsInputError('matchResiduePkas requires finite pKa values');
  }
  for (const annotated of residues) {
    if (!(Number.isInteger(annotated.position) && annotated.position >= 1)) {
      throw new KineticsInputError('matchResiduePkas requires positive integer residue positions');
    }
  }
  const ionizable = residues.filter((annotated) => Object.hasOwn(FREE_RESIDUE_PKA, annotated.residue.toUpperCase()));
  return fittedPkas.map((pKa) => ({
    pKa,
    candidates: ionizable
      .map((annotated) => {
        const freePka = FREE_RESIDUE_PKA[annotated.residue.toUpperCase()];
        return { ...annotated, freePka, shift: pKa - freePka };
      })
      .sort((first, second) => Math.abs(first.shift) - Math.abs(second.shift)),
  }));
}
