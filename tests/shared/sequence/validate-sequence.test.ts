import { describe, expect, it } from 'vitest';
import { findInvalidResidue, maxSequenceResidues, validateSequence } from '../../../shared/sequence/validate-sequence';

// Invented test sequences, not taken from any protein.
const ALL_TWENTY = 'ACDEFGHIKLMNPQRSTVWY';

describe('validateSequence', () => {
  it('accepts the 20 standard amino acids', () => {
    expect(validateSequence(ALL_TWENTY)).toEqual({ ok: true, sequence: ALL_TWENTY });
  });

  it('returns lower case as upper case', () => {
    expect(validateSequence('mkvlagh')).toEqual({ ok: true, sequence: 'MKVLAGH' });
  });

  it('refuses an empty sequence', () => {
    expect(validateSequence('')).toEqual({ ok: false, message: 'the sequence is empty' });
  });

  it('refuses a sequence longer than the limit', () => {
    expect(validateSequence('A'.repeat(maxSequenceResidues))).toMatchObject({ ok: true });
    expect(validateSequence('A'.repeat(maxSequenceResidues + 1))).toEqual({
      ok: false,
      message: `the sequence has ${maxSequenceResidues + 1} residues; at most ${maxSequenceResidues} are accepted`,
    });
  });

  it.each([
    ['MKVXL', "residue 4 is 'X': an unspecified amino acid (X); every position must be one of the 20 standard amino acids"],
    ['MKBL', "residue 3 is 'B': ambiguous (B, Asp or Asn); every position must be one of the 20 standard amino acids"],
    ['MZ', "residue 2 is 'Z': ambiguous (Z, Glu or Gln); every position must be one of the 20 standard amino acids"],
    ['Mj', "residue 2 is 'j': ambiguous (J, Leu or Ile); every position must be one of the 20 standard amino acids"],
    ['MKU', "residue 3 is 'U': selenocysteine (U), which is not supported; every position must be one of the 20 standard amino acids"],
    ['MKO', "residue 3 is 'O': pyrrolysine (O), which is not supported; every position must be one of the 20 standard amino acids"],
    ['MK*VL', "residue 3 is '*': a stop inside the sequence; only a final stop is allowed"],
    ['MK-VL', "residue 3 is '-': an alignment gap; paste the ungapped sequence"],
    ['MK.VL', "residue 3 is '.': an alignment gap; paste the ungapped sequence"],
    ['MK1VL', "residue 3 is '1': not an amino-acid letter; every position must be one of the 20 standard amino acids"],
    ['MK VL', "residue 3 is ' ': not an amino-acid letter; every position must be one of the 20 standard amino acids"],
  ])('refuses %j naming the residue', (sequence, message) => {
    expect(validateSequence(sequence)).toEqual({ ok: false, message });
  });
});

describe('findInvalidResidue', () => {
  it('returns undefined for a standard sequence', () => {
    expect(findInvalidResidue('mkvl')).toBeUndefined();
  });

  it('returns the first offending residue only', () => {
    expect(findInvalidResidue('MKXBZ')).toMatchObject({ position: 3, letter: 'X' });
  });
});
