import { describe, expect, it } from 'vitest';
import { KineticsInputError } from '../../../shared/kinetics/kinetics-input-error';
import { FREE_RESIDUE_PKA, matchResiduePkas } from '../../../shared/kinetics/residue-pka';

describe('matchResiduePkas', () => {
  it('uses the free-residue side-chain pKa values of Dawson et al., Data for Biochemical Research, 3rd ed. (1986)', () => {
    expect(FREE_RESIDUE_PKA).toEqual({ D: 3.9, E: 4.07, H: 6.04, C: 8.37, Y: 10.46, K: 10.54, R: 12.48 });
  });

  it('lists the ionizable annotated residues for each fitted pKa, smallest shift first', () => {
    const residues = [
      { position: 30, residue: 'D', role: 'general base' },
      { position: 10, residue: 'S', role: 'nucleophile' },
      { position: 20, residue: 'h', role: 'acid/base' },
      { position: 77, residue: 'C', role: 'other' },
    ];
    const [acid, base] = matchResiduePkas([4.6, 7.9], residues);
    expect(acid.pKa).toBe(4.6);
    expect(acid.candidates.map((candidate) => candidate.position)).toEqual([30, 20, 77]);
    expect(acid.candidates[0]).toMatchObject({ position: 30, residue: 'D', role: 'general base', freePka: 3.9 });
    expect(acid.candidates[0].shift).toBeCloseTo(0.7, 12);
    expect(base.candidates.map((candidate) => candidate.position)).toEqual([77, 20, 30]);
    expect(base.candidates[0].shift).toBeCloseTo(7.9 - 8.37, 12);
    expect(base.candidates[1]).toMatchObject({ residue: 'h', freePka: 6.04 });
  });

  it('returns no candidates when no annotated residue ionizes', () => {
    expect(matchResiduePkas([6], [{ position: 1, residue: 'G' }])).toEqual([{ pKa: 6, candidates: [] }]);
  });

  it('throws KineticsInputError for a non-finite pKa or a bad position', () => {
    expect(() => matchResiduePkas([Number.NaN], [])).toThrow(new KineticsInputError('matchResiduePkas requires finite pKa values'));
    expect(() => matchResiduePkas([6], [{ position: 0, residue: 'H' }])).toThrow(
      new KineticsInputError('matchResiduePkas requires positive integer residue positions'),
    );
    expect(() => matchResiduePkas([6], [{ position: 2.5, residue: 'H' }])).toThrow(KineticsInputError);
  });
});
