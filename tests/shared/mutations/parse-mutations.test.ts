import { describe, expect, it } from 'vitest';
import { parseMutations, type ParseMutationsOptions } from '../../../shared/mutations/parse-mutations';
import { maxSequenceResidues } from '../../../shared/sequence/validate-sequence';

/** An invented sequence: a repeating filler with chosen residues at chosen positions. */
function inventedSequence(length: number, residues: Readonly<Record<number, string>>): string {
  const filler = 'GASTVLKEDR';
  let sequence = '';
  for (let position = 1; position <= length; position += 1) {
    sequence += residues[position] ?? filler[(position - 1) % filler.length];
  }
  return sequence;
}

const PARENT = inventedSequence(300, { 1: 'M', 24: 'W', 44: 'S', 46: 'W', 76: 'R', 77: 'C', 112: 'C', 123: 'C', 190: 'H' });
const SER112_PARENT = inventedSequence(300, { 112: 'S' });
const withParent = { parentSequence: PARENT };

function valueOf(text: string, options: ParseMutationsOptions = withParent) {
  const result = parseMutations(text, options);
  if (!result.ok) throw new Error(`expected ${text} to parse: ${JSON.stringify(result.problems)}`);
  return result.value;
}

function problemsOf(text: string, options: ParseMutationsOptions = withParent) {
  const result = parseMutations(text, options);
  if (result.ok) throw new Error(`expected ${text} to be refused`);
  return result.problems;
}

// Examples of the HGVS recommendations, hgvs-nomenclature.org, "Protein: substitution"
// (https://hgvs-nomenclature.org/stable/recommendations/protein/substitution/, read in the stored
// copies of versions 21.0.0 and 21.1.1): missense LRG_199p1:p.Trp24Cys and predicted
// NP_003997.1:p.(Trp24Cys); nonsense p.Trp24Ter, also written p.Trp24* and NP_003997.1:p.W24*;
// p.(Arg727Ser) from the notes; silent p.Cys123=; and p.[Arg76Ser;Cys77Trp], which the page notes
// HGVS would rather write as a delins (a registry of designed variants records the two substitutions).
describe('parseMutations on the HGVS substitution examples', () => {
  it('reads LRG_199p1:p.Trp24Cys', () => {
    expect(valueOf('LRG_199p1:p.Trp24Cys')).toEqual({
      mutations: [{ position: 24, from: 'W', to: 'C' }],
      label: 'W24C',
      hgvs: 'p.Trp24Cys',
    });
  });

  it('reads the predicted NP_003997.1:p.(Trp24Cys) as the same substitution', () => {
    expect(valueOf('NP_003997.1:p.(Trp24Cys)')).toEqual(valueOf('p.Trp24Cys'));
  });

  it.each(['p.Trp24Ter', 'p.Trp24*', 'NP_003997.1:p.W24*', 'W24*', 'Trp24ter'])('reads the nonsense change %s', (text) => {
    expect(valueOf(text)).toEqual({ mutations: [{ position: 24, from: 'W', to: '*' }], label: 'W24*', hgvs: 'p.Trp24Ter' });
  });

  it('reads p.(Arg727Ser) by format alone', () => {
    expect(valueOf('p.(Arg727Ser)', {})).toMatchObject({ label: 'R727S', hgvs: 'p.Arg727Ser' });
  });

  it('refuses the silent p.Cys123= as synonymous', () => {
    expect(problemsOf('p.Cys123=')).toEqual([
      { token: 'p.Cys123=', message: 'synonymous change, position 123 stays Cys; list only residues that change' },
    ]);
  });

  it('reads p.[Arg76Ser;Cys77Trp] as two substitutions', () => {
    expect(valueOf('p.[Arg76Ser;Cys77Trp]')).toEqual({
      mutations: [
        { position: 76, from: 'R', to: 'S' },
        { position: 77, from: 'C', to: 'W' },
      ],
      label: 'R76S/C77W',
      hgvs: 'p.[Arg76Ser;Cys77Trp]',
    });
  });

  // Allele notation for two changes on one chain, as in the HGVS "Alleles" recommendations
  // (example written from memory of those pages, not re-read).
  it('reads p.[Ser44Arg;Trp46Arg]', () => {
    expect(valueOf('p.[Ser44Arg;Trp46Arg]')).toMatchObject({ label: 'S44R/W46R', hgvs: 'p.[Ser44Arg;Trp46Arg]' });
  });
});

describe('parseMutations notations', () => {
  it.each(['C112A', 'Cys112Ala', 'cys112ala', 'CYS112ALA', 'c112a', 'p.Cys112Ala', 'p.(Cys112Ala)', 'p.C112A', ' C112A '])(
    'reads %j as C112A',
    (text) => {
      expect(valueOf(text)).toEqual({ mutations: [{ position: 112, from: 'C', to: 'A' }], label: 'C112A', hgvs: 'p.Cys112Ala' });
    },
  );

  it.each([
    'C112A/H190N',
    'C112A+H190N',
    'C112A H190N',
    'C112A, H190N',
    'C112A;H190N',
    'H190N/C112A',
    'Cys112Ala / p.His190Asn',
    'p.[Cys112Ala;His190Asn]',
    'p.[His190Asn; Cys112Ala]',
    'p.([Cys112Ala;His190Asn])',
    'p.[(Cys112Ala;His190Asn)]',
    'XP_000000.1:p.[Cys112Ala;His190Asn]',
    'C112A/\nH190N',
  ])('reads %j as C112A/H190N', (text) => {
    expect(valueOf(text)).toEqual({
      mutations: [
        { position: 112, from: 'C', to: 'A' },
        { position: 190, from: 'H', to: 'N' },
      ],
      label: 'C112A/H190N',
      hgvs: 'p.[Cys112Ala;His190Asn]',
    });
  });

  it('orders three substitutions by position', () => {
    expect(valueOf('H190N W24F C112S').label).toBe('W24F/C112S/H190N');
  });

  it('ignores a trailing separator, as while typing', () => {
    expect(valueOf('C112A/').label).toBe('C112A');
  });

  it.each(['', '   ', 'parent', 'Parent', 'WT', 'wild type', 'wild-type', 'p.='])('reads %j as the parent', (text) => {
    expect(valueOf(text)).toEqual({ mutations: [], label: 'parent', hgvs: 'p.=' });
  });

  it('reads back its own label and HGVS description', () => {
    const first = valueOf('p.[His190Asn;Trp24Ter;Cys112Ala]');
    expect(valueOf(first.label)).toEqual(first);
    expect(valueOf(first.hgvs)).toEqual(first);
  });
});

describe('parseMutations against the parent', () => {
  it('refuses a parent residue that does not match', () => {
    expect(problemsOf('C112A', { parentSequence: SER112_PARENT })).toEqual([
      { token: 'C112A', message: 'position 112 of the parent is Ser, not Cys' },
    ]);
  });

  it('names residues in three letters whatever the notation', () => {
    expect(problemsOf('p.Ser24Ala')).toEqual([{ token: 'p.Ser24Ala', message: 'position 24 of the parent is Trp, not Ser' }]);
  });

  it('refuses a position beyond the parent', () => {
    expect(problemsOf('A400G')).toEqual([{ token: 'A400G', message: 'position 400 is beyond the parent sequence (300 residues)' }]);
    expect(valueOf('R300A').label).toBe('R300A');
  });

  it('checks every substitution of an allele', () => {
    expect(problemsOf('p.[Cys112Ala;Ser190Asn]')).toEqual([
      { token: 'Ser190Asn', message: 'position 190 of the parent is His, not Ser' },
    ]);
  });
});

describe('parseMutations without a parent', () => {
  it('checks the notation only', () => {
    expect(valueOf('C112A/Q5E', {}).label).toBe('Q5E/C112A');
    expect(valueOf('C112A', {})).toEqual(valueOf('C112A'));
  });

  it('refuses a position beyond the longest accepted sequence', () => {
    expect(valueOf(`A${maxSequenceResidues}G`, {}).mutations).toHaveLength(1);
    expect(problemsOf(`A${maxSequenceResidues + 1}G`, {})).toEqual([
      {
        token: `A${maxSequenceResidues + 1}G`,
        message: `position ${maxSequenceResidues + 1} is beyond the longest accepted sequence (${maxSequenceResidues} residues)`,
      },
    ]);
  });
});

describe('parseMutations refusals', () => {
  it.each([
    ['Xaa112Ala', "unknown amino acid 'Xaa'"],
    ['Sec112Ala', "unknown amino acid 'Sec'"],
    ['C112B', "unknown amino acid 'B'"],
    ['C112Zzz', "unknown amino acid 'Zzz'"],
    ['C112X', "unknown amino acid 'X'; write * or Ter for a stop"],
  ])('refuses the unknown amino acid in %s', (token, message) => {
    expect(problemsOf(token)).toEqual([{ token, message }]);
  });

  it.each(['C112', '112A', 'C112Al', 'hello', 'C1.5A', 'p.(Cys112Ala', '(C112A)', 'Cys-112-Ala'])(
    'refuses the unparseable %j',
    (token) => {
      expect(problemsOf(token)).toEqual([{ token, message: 'not a substitution (e.g. C112A, Cys112Ala or p.Cys112Ala)' }]);
    },
  );

  it('refuses DNA notation with a hint', () => {
    expect(problemsOf('c.334T>G')).toEqual([
      { token: 'c.334T>G', message: 'a DNA or RNA description, not a protein change (e.g. C112A, Cys112Ala or p.Cys112Ala)' },
    ]);
  });

  it.each(['p.Lys2del', 'p.Gly4dup', 'p.Arg76_Cys77delinsSerTrp', 'p.Lys2_Gly3insGlnSerLys', 'p.Arg97ProfsTer23', 'p.Ter110GlnextTer17'])(
    'refuses the non-substitution %s',
    (token) => {
      expect(problemsOf(token)).toEqual([
        { token, message: 'only substitutions are supported, not deletions, insertions, duplications, frameshifts or extensions' },
      ]);
    },
  );

  it.each(['C0A', 'C-5A'])('refuses the position of %s', (token) => {
    const position = token.slice(1, -1);
    expect(problemsOf(token)).toEqual([{ token, message: `position ${position} is not valid; residues are numbered from 1` }]);
  });

  it('refuses a stop as the parent residue', () => {
    for (const token of ['Ter112Ala', '*112A']) {
      expect(problemsOf(token, {})).toEqual([
        { token, message: 'the parent residue cannot be a stop (Ter); only amino-acid substitutions are supported' },
      ]);
    }
  });

  it('refuses a synonymous change', () => {
    expect(problemsOf('C112C')).toEqual([
      { token: 'C112C', message: 'synonymous change, position 112 stays Cys; list only residues that change' },
    ]);
    expect(problemsOf('Cys112cys', {})).toHaveLength(1);
  });

  it('refuses two changes at one position', () => {
    expect(problemsOf('C112A/C112S')).toEqual([{ token: 'C112S', message: 'two changes at position 112 (C112A and C112S)' }]);
  });

  it('refuses the same change written twice', () => {
    expect(problemsOf('C112A+p.Cys112Ala')).toEqual([{ token: 'p.Cys112Ala', message: 'C112A is listed twice' }]);
  });

  it('refuses an allele with nothing in it', () => {
    for (const token of ['p.[]', 'p.[;]', '/', ' , + ']) {
      expect(problemsOf(token)).toEqual([{ token: token.trim(), message: 'no substitutions found; leave the field empty for the parent' }]);
    }
  });

  it('lists every problem in the order written', () => {
    expect(problemsOf('C112A/A400G/H190N/Q5E/K7Z/R190Y/R190W', { parentSequence: SER112_PARENT })).toEqual([
      { token: 'C112A', message: 'position 112 of the parent is Ser, not Cys' },
      { token: 'A400G', message: 'position 400 is beyond the parent sequence (300 residues)' },
      { token: 'H190N', message: 'position 190 of the parent is Arg, not His' },
      { token: 'Q5E', message: 'position 5 of the parent is Val, not Gln' },
      { token: 'K7Z', message: "unknown amino acid 'Z'" },
      { token: 'R190W', message: 'two changes at position 190 (R190Y and R190W)' },
    ]);
  });
});
