import { describe, expect, it } from 'vitest';
import type { z } from 'zod';
import {
  catalyticRoles,
  catalyticSiteInput,
  catalyticSiteProblem,
  cofactorLabels,
  cofactors,
  createEnzymeInput,
  updateEnzymeInput,
} from '../../../shared/schemas/enzyme';

// An invented 40-residue sequence: Ser at 10, His at 20, Asp at 30.
const SEQUENCE = 'MKVLAGTEQSNWFPYGLKTHAGVLEKPQRDTLNVGAEKFY';

const validEnzyme = {
  name: 'Thermoamidase A',
  ecNumber: 'EC 3.5.1.4',
  organism: 'Invented thermophile',
  sequence: SEQUENCE,
};

/** `{ 'field.path': message }` for a failed parse, as the API reports it. */
function fieldsOf(schema: z.ZodType, value: unknown): Record<string, string> {
  const result = schema.safeParse(value);
  if (result.success) throw new Error('expected the input to be refused');
  return Object.fromEntries(result.error.issues.map((issue) => [issue.path.join('.'), issue.message]));
}

describe('createEnzymeInput', () => {
  it('accepts an enzyme and fills defaults', () => {
    expect(createEnzymeInput.parse(validEnzyme)).toEqual({
      name: 'Thermoamidase A',
      ecNumber: '3.5.1.4',
      accession: null,
      organism: 'Invented thermophile',
      sequence: SEQUENCE,
      cofactors: [],
      otherCofactors: '',
      sites: [],
    });
  });

  it('stores canonical accession, cofactors and a pasted sequence', () => {
    const parsed = createEnzymeInput.parse({
      ...validEnzyme,
      accession: ' q1aaa9 ',
      cofactors: ['Zn2+', 'NAD(P)H'],
      otherCofactors: ' Ca2+ ',
      sequence: `>amdA invented\n1 ${SEQUENCE.slice(0, 20).toLowerCase()}\n21 ${SEQUENCE.slice(20)}*\n`,
    });
    expect(parsed).toMatchObject({ accession: 'Q1AAA9', cofactors: ['Zn2+', 'NAD(P)H'], otherCofactors: 'Ca2+', sequence: SEQUENCE });
  });

  it('reads an empty accession as none', () => {
    expect(createEnzymeInput.parse({ ...validEnzyme, accession: '' }).accession).toBeNull();
  });

  it('names each bad field with a specific message', () => {
    expect(
      fieldsOf(createEnzymeInput, {
        name: ' ',
        ecNumber: '9.1.1.1',
        accession: 'P12345-2',
        organism: '',
        sequence: 'MKVXL',
        cofactors: ['Zn2+', 'Ca2+'],
      }),
    ).toEqual({
      name: 'is required',
      ecNumber: 'EC class must be 1 to 7 (the first part), got 9',
      accession: "'P12345-2' names isoform 2; enter the entry's accession P12345 and describe the isoform in the sequence",
      organism: 'is required (write "synthetic construct" for a designed enzyme)',
      sequence: "residue 4 is 'X': an unspecified amino acid (X); every position must be one of the 20 standard amino acids",
      'cofactors.1': 'must be one of Zn2+, Mg2+, Mn2+, Fe2+, Cu2+, heme, PLP, FAD, NAD(P)H',
    });
  });

  it('reports missing fields', () => {
    expect(fieldsOf(createEnzymeInput, {})).toEqual({
      name: 'is required',
      ecNumber: 'is required',
      organism: 'is required',
      sequence: 'is required',
    });
  });

  it('refuses a text with several FASTA records', () => {
    expect(fieldsOf(createEnzymeInput, { ...validEnzyme, sequence: '>a\nMKV\n>b\nGHE' })).toEqual({
      sequence: 'contains 2 FASTA records; paste one, or upload the file and pick a record',
    });
  });

  it('refuses a cofactor listed twice', () => {
    expect(fieldsOf(createEnzymeInput, { ...validEnzyme, cofactors: ['FAD', 'FAD'] })).toEqual({
      cofactors: 'lists a cofactor twice',
    });
  });

  it('accepts catalytic sites that match the sequence', () => {
    const parsed = createEnzymeInput.parse({
      ...validEnzyme,
      sites: [
        { position: 10, residue: 'Ser', role: 'nucleophile' },
        { position: 20, residue: 'h', role: 'general base', expectedPka: 6.5 },
        { position: 20, residue: 'H', role: 'acid/base' },
      ],
    });
    expect(parsed.sites).toEqual([
      { position: 10, residue: 'S', role: 'nucleophile' },
      { position: 20, residue: 'H', role: 'general base', expectedPka: 6.5 },
      { position: 20, residue: 'H', role: 'acid/base' },
    ]);
  });

  it('refuses sites that do not match the sequence, or repeat', () => {
    expect(
      fieldsOf(createEnzymeInput, {
        ...validEnzyme,
        sites: [
          { position: 10, residue: 'C', role: 'nucleophile' },
          { position: 41, residue: 'H', role: 'general base' },
          { position: 30, residue: 'D', role: 'electrostatic' },
          { position: 30, residue: 'D', role: 'electrostatic' },
        ],
      }),
    ).toEqual({
      'sites.0.residue': 'position 10 of the sequence is Ser, not Cys',
      'sites.1.position': 'position 41 is beyond the sequence (40 residues)',
      'sites.3.role': 'repeats site 3 (position 30, electrostatic)',
    });
  });
});

describe('catalyticSiteInput', () => {
  it('refuses each bad field with a specific message', () => {
    expect(fieldsOf(catalyticSiteInput, { position: 0, residue: 'X', role: 'catalyst', expectedPka: 15 })).toEqual({
      position: 'must be at least 1 (residues are numbered from 1)',
      residue: "must be a standard amino acid such as C or Cys, got 'X'",
      role: `must be one of ${catalyticRoles.join(', ')}`,
      expectedPka: 'must be between 0 and 14',
    });
    expect(fieldsOf(catalyticSiteInput, { position: 2.5, residue: '*', role: 'other', expectedPka: -1 })).toEqual({
      position: 'must be a whole number',
      residue: "must be a standard amino acid such as C or Cys, got '*'",
      expectedPka: 'must be between 0 and 14',
    });
  });

  it('accepts every role', () => {
    for (const role of catalyticRoles) {
      expect(catalyticSiteInput.parse({ position: 1, residue: 'M', role }).role).toBe(role);
    }
  });

  it('takes an optional note, trimmed, with a blank note as none, and refuses one over 500 characters', () => {
    const site = { position: 1, residue: 'M', role: 'other' };
    expect(catalyticSiteInput.parse({ ...site, note: '  start codon  ' }).note).toBe('start codon');
    expect(catalyticSiteInput.parse({ ...site, note: '   ' }).note).toBeNull();
    expect(catalyticSiteInput.parse({ ...site, note: null }).note).toBeNull();
    expect(catalyticSiteInput.parse(site).note).toBeUndefined();
    expect(catalyticSiteInput.parse({ ...site, note: ` ${'n'.repeat(500)} ` }).note).toHaveLength(500);
    expect(fieldsOf(catalyticSiteInput, { ...site, note: 'n'.repeat(501) })).toEqual({ note: 'must be at most 500 characters' });
    expect(fieldsOf(catalyticSiteInput, { ...site, note: 7 })).toEqual({ note: 'must be text or null' });
  });
});

describe('catalyticSiteProblem', () => {
  it('accepts a matching site', () => {
    expect(catalyticSiteProblem({ position: 20, residue: 'H' }, SEQUENCE)).toBeUndefined();
  });

  it('names the residue the sequence has', () => {
    expect(catalyticSiteProblem({ position: 2, residue: 'C' }, 'MSKV')).toEqual({
      field: 'residue',
      message: 'position 2 of the sequence is Ser, not Cys',
    });
  });
});

describe('updateEnzymeInput', () => {
  it('takes the version and only the fields given', () => {
    expect(updateEnzymeInput.parse({ version: 3, name: 'Thermoamidase B' })).toEqual({ version: 3, name: 'Thermoamidase B' });
  });

  it('clears the accession with null or an empty string', () => {
    expect(updateEnzymeInput.parse({ version: 3, accession: null })).toEqual({ version: 3, accession: null });
    expect(updateEnzymeInput.parse({ version: 3, accession: '' })).toEqual({ version: 3, accession: null });
  });

  it('validates changed fields like creation does', () => {
    expect(fieldsOf(updateEnzymeInput, { version: 3, ecNumber: '3.5.1', sequence: '' })).toEqual({
      ecNumber: "EC number '3.5.1' has 3 parts; it needs four separated by dots (e.g. 3.5.1.4, or 3.5.1.- when the last levels are unknown)",
      sequence: 'no sequence found',
    });
  });

  it('requires the version', () => {
    expect(fieldsOf(updateEnzymeInput, { name: 'x' })).toEqual({ version: 'is required' });
  });

  it('refuses an update that changes nothing', () => {
    expect(fieldsOf(updateEnzymeInput, { version: 3 })).toEqual({ name: 'give at least one field to change' });
  });
});

describe('constants for the forms', () => {
  it('labels every cofactor', () => {
    expect(Object.keys(cofactorLabels).sort()).toEqual([...cofactors].sort());
    expect(cofactorLabels['Zn2+']).toBe('Zn²⁺');
  });
});
