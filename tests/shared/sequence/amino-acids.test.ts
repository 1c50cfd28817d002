import { describe, expect, it } from 'vitest';
import {
  aminoAcidFromOneLetter,
  aminoAcidFromSymbol,
  aminoAcidFromThreeLetter,
  standardAminoAcids,
  stopResidue,
} from '../../../shared/sequence/amino-acids';

// Symbols checked against IUPAC-IUB JCBN, "Nomenclature and symbolism for amino acids and peptides",
// Eur. J. Biochem. 138:9-37 (1984), table 3AA-1.
describe('standardAminoAcids', () => {
  it('holds the 20 standard amino acids with distinct symbols', () => {
    expect(standardAminoAcids).toHaveLength(20);
    expect(new Set(standardAminoAcids.map((aminoAcid) => aminoAcid.oneLetter)).size).toBe(20);
    expect(new Set(standardAminoAcids.map((aminoAcid) => aminoAcid.threeLetter)).size).toBe(20);
    expect(standardAminoAcids.map((aminoAcid) => aminoAcid.oneLetter).sort().join('')).toBe('ACDEFGHIKLMNPQRSTVWY');
  });

  it('pairs each one-letter symbol with its three-letter symbol', () => {
    const pairs = Object.fromEntries(standardAminoAcids.map((aminoAcid) => [aminoAcid.oneLetter, aminoAcid.threeLetter]));
    expect(pairs).toEqual({
      A: 'Ala', R: 'Arg', N: 'Asn', D: 'Asp', C: 'Cys', E: 'Glu', Q: 'Gln', G: 'Gly', H: 'His', I: 'Ile',
      L: 'Leu', K: 'Lys', M: 'Met', F: 'Phe', P: 'Pro', S: 'Ser', T: 'Thr', W: 'Trp', Y: 'Tyr', V: 'Val',
    });
  });
});

describe('aminoAcidFromOneLetter', () => {
  it('finds a residue in either case', () => {
    expect(aminoAcidFromOneLetter('C')?.threeLetter).toBe('Cys');
    expect(aminoAcidFromOneLetter('c')?.name).toBe('cysteine');
  });

  it('finds the stop as *', () => {
    expect(aminoAcidFromOneLetter('*')).toBe(stopResidue);
  });

  it('finds nothing for ambiguity and non-standard symbols', () => {
    for (const symbol of ['X', 'B', 'Z', 'J', 'U', 'O', '-', '', 'CC']) {
      expect(aminoAcidFromOneLetter(symbol)).toBeUndefined();
    }
  });
});

describe('aminoAcidFromThreeLetter', () => {
  it('accepts Cys, cys and CYS', () => {
    for (const symbol of ['Cys', 'cys', 'CYS']) expect(aminoAcidFromThreeLetter(symbol)?.oneLetter).toBe('C');
  });

  it('finds the stop as Ter', () => {
    expect(aminoAcidFromThreeLetter('ter')).toBe(stopResidue);
    expect(stopResidue.oneLetter).toBe('*');
  });

  it('finds nothing for Sec, Xaa or a misspelling', () => {
    for (const symbol of ['Sec', 'Pyl', 'Xaa', 'Asx', 'Cis']) expect(aminoAcidFromThreeLetter(symbol)).toBeUndefined();
  });
});

describe('aminoAcidFromSymbol', () => {
  it('reads one character as one-letter and three as three-letter', () => {
    expect(aminoAcidFromSymbol('H')?.threeLetter).toBe('His');
    expect(aminoAcidFromSymbol('his')?.oneLetter).toBe('H');
  });

  it('finds nothing for other lengths', () => {
    expect(aminoAcidFromSymbol('Hi')).toBeUndefined();
    expect(aminoAcidFromSymbol('Hist')).toBeUndefined();
  });
});
