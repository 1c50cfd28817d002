import { describe, expect, it } from 'vitest';
import { parseFasta } from '../../../shared/sequence/parse-fasta';
import { maxSequenceResidues } from '../../../shared/sequence/validate-sequence';

// Every sequence here is invented for the test; none is a real protein.
describe('parseFasta', () => {
  it('reads one record with id and description', () => {
    expect(parseFasta('>amd-1 invented amidase, round 0\nMKVLAGHE\nSTNQ\n')).toEqual({
      ok: true,
      records: [{ header: 'amd-1 invented amidase, round 0', id: 'amd-1', description: 'invented amidase, round 0', sequence: 'MKVLAGHESTNQ' }],
    });
  });

  it('keeps the spacing inside a description', () => {
    const parsed = parseFasta('>sp|Q1AAA9|TEST_X  two  spaces\nMKV');
    expect(parsed).toMatchObject({ ok: true, records: [{ id: 'sp|Q1AAA9|TEST_X', description: 'two  spaces' }] });
  });

  it('reads several records in order', () => {
    const parsed = parseFasta('>first\nMKV\n>second\nGHE\n>third\nSTN\n');
    expect(parsed.ok && parsed.records.map((record) => [record.id, record.sequence])).toEqual([
      ['first', 'MKV'],
      ['second', 'GHE'],
      ['third', 'STN'],
    ]);
  });

  it('tolerates Windows and old Mac line endings, blank lines and a byte-order mark', () => {
    const parsed = parseFasta('\uFEFF\r\n>win\r\nMKV\r\n\r\nLAG\r>mac\rHES\r\n');
    expect(parsed.ok && parsed.records.map((record) => [record.id, record.sequence])).toEqual([
      ['win', 'MKVLAG'],
      ['mac', 'HES'],
    ]);
  });

  it('drops whitespace and digits inside sequence lines', () => {
    const pasted = '>numbered\n     1 mkvlaghest nqwfpydcir\n    21 MKVLA\tGHEST 30\n';
    expect(parseFasta(pasted)).toMatchObject({ ok: true, records: [{ sequence: 'MKVLAGHESTNQWFPYDCIRMKVLAGHEST' }] });
  });

  it('strips one final stop per record', () => {
    const parsed = parseFasta('>a\nMKV*\n>b\nGHE\n*\n');
    expect(parsed.ok && parsed.records.map((record) => record.sequence)).toEqual(['MKV', 'GHE']);
  });

  it('skips ; comment lines', () => {
    expect(parseFasta(';old-style comment\n>a\nMKV\n;another\nGHE')).toMatchObject({ ok: true, records: [{ sequence: 'MKVGHE' }] });
  });

  it('reads text without a header as one raw sequence', () => {
    expect(parseFasta('  mkvlag\nhest *\n')).toEqual({
      ok: true,
      records: [{ header: '', id: '', description: '', sequence: 'MKVLAGHEST' }],
    });
  });

  it('accepts a header without an id', () => {
    expect(parseFasta('>\nMKV')).toMatchObject({ ok: true, records: [{ header: '', id: '', sequence: 'MKV' }] });
  });

  it('refuses a letter that is not a standard amino acid, naming letter, residue and line', () => {
    expect(parseFasta('>amd-1\nMKVLA\nGHJST\n')).toEqual({
      ok: false,
      message:
        "record 'amd-1': residue 8 (line 3) is 'J': ambiguous (J, Leu or Ile); every position must be one of the 20 standard amino acids",
    });
  });

  it('names the record by number when its header has no id', () => {
    expect(parseFasta('>a\nMKV\n>\nMKX')).toEqual({
      ok: false,
      message: "record 2: residue 3 is 'X': an unspecified amino acid (X); every position must be one of the 20 standard amino acids",
    });
  });

  it('refuses a raw sequence with a non-amino-acid letter without naming a record', () => {
    expect(parseFasta('MKV@LAG')).toEqual({
      ok: false,
      message: "residue 4 is '@': not an amino-acid letter; every position must be one of the 20 standard amino acids",
    });
  });

  it('refuses a stop inside the sequence', () => {
    expect(parseFasta('>a\nMK*V')).toEqual({
      ok: false,
      message: "record 'a': residue 3 is '*': a stop inside the sequence; only a final stop is allowed",
    });
  });

  it('refuses an empty record', () => {
    expect(parseFasta('>a\nMKV\n>empty record\n\n>c\nGHE')).toEqual({
      ok: false,
      message: "record 'empty' (line 3) has no sequence",
    });
  });

  it('refuses a record holding only a stop', () => {
    expect(parseFasta('>a\n*')).toEqual({ ok: false, message: "record 'a' (line 1) has no sequence" });
  });

  it('refuses sequence before the first header', () => {
    expect(parseFasta('MKV\n>a\nGHE')).toEqual({ ok: false, message: "line 1 has sequence before the first '>' header" });
  });

  it('refuses text with no sequence', () => {
    for (const text of ['', '  \n\r\n', '123 456', '*']) {
      expect(parseFasta(text)).toEqual({ ok: false, message: 'no sequence found' });
    }
  });

  it('refuses a record longer than the limit', () => {
    expect(parseFasta(`>long\n${'A'.repeat(maxSequenceResidues + 1)}`)).toEqual({
      ok: false,
      message: `record 'long': the sequence has ${maxSequenceResidues + 1} residues; at most ${maxSequenceResidues} are accepted`,
    });
  });
});
