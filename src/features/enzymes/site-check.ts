import { catalyticSiteProblem } from '@shared/schemas/enzyme';
import { aminoAcidFromOneLetter, aminoAcidFromSymbol } from '@shared/sequence/amino-acids';

export type SiteCheck =
  | { kind: 'incomplete' }
  | { kind: 'matches'; message: string }
  | { kind: 'problem'; field: 'position' | 'residue'; message: string };

/**
 * Checks a site as it is typed against the sequence, with the schema's own rule (catalyticSiteProblem),
 * so the message under the field is the one the server would give on saving.
 */
export function checkSite(positionText: unknown, residueText: unknown, sequence: string): SiteCheck {
  const position = typeof positionText === 'number' ? positionText : Number(String(positionText ?? '').trim());
  const residue = String(residueText ?? '').trim();
  if (!Number.isInteger(position) || position < 1 || sequence === '') return { kind: 'incomplete' };
  if (residue === '') {
    if (position > sequence.length) return { kind: 'problem', field: 'position', message: `position ${position} is beyond the sequence (${sequence.length} residues)` };
    return { kind: 'incomplete' };
  }
  const aminoAcid = aminoAcidFromSymbol(residue);
  if (!aminoAcid || aminoAcid.oneLetter === '*') {
    return { kind: 'problem', field: 'residue', message: `must be a standard amino acid such as C or Cys, got '${residue}'` };
  }
  const problem = catalyticSiteProblem({ position, residue: aminoAcid.oneLetter }, sequence);
  if (problem) return { kind: 'problem', field: problem.field, message: problem.message };
  return { kind: 'matches', message: `position ${position} of the sequence is ${aminoAcid.threeLetter}` };
}

/** The residue the sequence has at a typed position, for a hint before the residue is typed. */
export function residueAt(positionText: unknown, sequence: string): string | null {
  const position = typeof positionText === 'number' ? positionText : Number(String(positionText ?? '').trim());
  if (!Number.isInteger(position) || position < 1 || position > sequence.length) return null;
  const aminoAcid = aminoAcidFromOneLetter(sequence[position - 1]);
  return aminoAcid ? `${aminoAcid.threeLetter} (${aminoAcid.oneLetter})` : null;
}
