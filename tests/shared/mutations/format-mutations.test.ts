import { describe, expect, it } from 'vitest';
import {
  formatMutation,
  formatMutationHgvs,
  formatMutationLabel,
  mutationKey,
  type Mutation,
} from '../../../shared/mutations/format-mutations';

const C112A: Mutation = { position: 112, from: 'C', to: 'A' };
const H190N: Mutation = { position: 190, from: 'H', to: 'N' };
const W24STOP: Mutation = { position: 24, from: 'W', to: '*' };

describe('formatMutation', () => {
  it('writes one-letter shorthand', () => {
    expect(formatMutation(C112A)).toBe('C112A');
    expect(formatMutation(W24STOP)).toBe('W24*');
  });

  it('upper-cases lower-case residues', () => {
    expect(formatMutation({ position: 5, from: 'c', to: 'a' })).toBe('C5A');
  });

  it('refuses a residue that is not a standard one-letter code', () => {
    expect(() => formatMutation({ position: 5, from: 'X', to: 'A' })).toThrow(
      "formatMutation requires a standard one-letter parent residue, got 'X'",
    );
    expect(() => formatMutation({ position: 5, from: '*', to: 'A' })).toThrow(
      "formatMutation requires a standard one-letter parent residue, got '*'",
    );
    expect(() => formatMutation({ position: 5, from: 'C', to: 'Ala' })).toThrow(
      "formatMutation requires a standard one-letter new residue or '*', got 'Ala'",
    );
  });
});

describe('formatMutationLabel', () => {
  it('orders by position and joins with /', () => {
    expect(formatMutationLabel([H190N, C112A])).toBe('C112A/H190N');
  });

  it('labels the empty set parent', () => {
    expect(formatMutationLabel([])).toBe('parent');
  });

  it('leaves its input as it was', () => {
    const input = Object.freeze([H190N, C112A]);
    formatMutationLabel(input);
    expect(input).toEqual([H190N, C112A]);
  });

  it('refuses two substitutions at one position', () => {
    expect(() => formatMutationLabel([C112A, { position: 112, from: 'C', to: 'S' }])).toThrow(
      'formatMutationLabel requires one substitution per position, got two at 112',
    );
  });

  it('refuses a position that is not a whole number from 1', () => {
    expect(() => formatMutationLabel([{ position: 0, from: 'C', to: 'A' }])).toThrow(
      'formatMutationLabel requires positions that are whole numbers from 1, got 0',
    );
    expect(() => formatMutationLabel([{ position: 1.5, from: 'C', to: 'A' }])).toThrow(
      'formatMutationLabel requires positions that are whole numbers from 1, got 1.5',
    );
  });
});

// HGVS forms from hgvs-nomenclature.org, "Protein: substitution" (p.Trp24Ter) and the allele
// notation p.[...;...] for several changes on one chain.
describe('formatMutationHgvs', () => {
  it('writes one substitution with three-letter residues', () => {
    expect(formatMutationHgvs([C112A])).toBe('p.Cys112Ala');
  });

  it('writes a stop as Ter', () => {
    expect(formatMutationHgvs([W24STOP])).toBe('p.Trp24Ter');
  });

  it('writes several substitutions as one allele in position order', () => {
    expect(formatMutationHgvs([H190N, C112A])).toBe('p.[Cys112Ala;His190Asn]');
  });

  it('writes the empty set as p.=', () => {
    expect(formatMutationHgvs([])).toBe('p.=');
  });

  it('refuses two substitutions at one position', () => {
    expect(() => formatMutationHgvs([C112A, C112A])).toThrow(
      'formatMutationHgvs requires one substitution per position, got two at 112',
    );
  });
});

describe('mutationKey', () => {
  it('is the same for the same set in any order', () => {
    expect(mutationKey([H190N, C112A, W24STOP])).toBe(mutationKey([W24STOP, C112A, H190N]));
    expect(mutationKey([H190N, C112A, W24STOP])).toBe('W24*/C112A/H190N');
  });

  it('differs for different sets', () => {
    expect(mutationKey([C112A])).not.toBe(mutationKey([{ position: 112, from: 'C', to: 'S' }]));
    expect(mutationKey([C112A])).not.toBe(mutationKey([C112A, H190N]));
  });

  it('is parent for the empty set', () => {
    expect(mutationKey([])).toBe('parent');
  });
});
