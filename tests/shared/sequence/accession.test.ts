import { describe, expect, it } from 'vitest';
import { uniprotAccessionPattern, validateAccession } from '../../../shared/sequence/accession';

// Examples from UniProt's documentation of the accession format: "Accession numbers", UniProt help
// (uniprot.org/help/accession_numbers: A2BC19, P12345, A0A023GPI8) and its 2009 version in the
// UniProt manual (P4A123, Q1AAA9). Only the format is checked; nothing is looked up.
describe('validateAccession', () => {
  it.each(['A2BC19', 'P12345', 'A0A023GPI8', 'P4A123', 'Q1AAA9'])('accepts the documented example %s', (accession) => {
    expect(validateAccession(accession)).toEqual({ ok: true, value: accession });
  });

  it('trims and upper-cases', () => {
    expect(validateAccession('  a0a023gpi8 ')).toEqual({ ok: true, value: 'A0A023GPI8' });
  });

  it.each([
    // After A-N or R-Z the third character must be a letter (keeps clear of nucleotide accessions).
    'A01234',
    // Six characters are required at the least.
    'P1234',
    // Ten-character accessions repeat the whole letter-digit block.
    'A0A023GPI',
    // O, P and Q take only the six-character form.
    'P0A023GPI8',
    'P12345X',
    '12345P',
  ])('refuses %s', (accession) => {
    expect(validateAccession(accession)).toEqual({
      ok: false,
      message: `'${accession}' is not a UniProtKB accession (6 or 10 characters such as P12345 or A0A023GPI8)`,
    });
  });

  it('refuses an isoform suffix, naming the entry accession', () => {
    expect(validateAccession('P12345-2')).toEqual({
      ok: false,
      message: "'P12345-2' names isoform 2; enter the entry's accession P12345 and describe the isoform in the sequence",
    });
  });

  it('refuses an empty accession', () => {
    expect(validateAccession('  ')).toEqual({ ok: false, message: 'accession is empty' });
  });

  it('anchors the published pattern', () => {
    expect(uniprotAccessionPattern.test('xP12345x')).toBe(false);
  });
});
