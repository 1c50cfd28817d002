import { fitPhProfile, type PhBellFitResult } from '@shared/kinetics/fit-ph-profile';
import { KineticsInputError } from '@shared/kinetics/kinetics-input-error';
import { matchResiduePkas } from '@shared/kinetics/residue-pka';
import type { Estimate, FitResult } from '@shared/kinetics/types';
import type { CatalyticSiteDto } from '@shared/schemas/enzyme';
import type { CreatePhProfileInput, PhModelName } from '@shared/schemas/ph-profile';
import type { GridPoint } from './point-grid';

/** A fitted pKa under the name the API stores it by: pKa1 for the acidic limb, pKa2 for the basic one. */
export interface FittedPka {
  parameter: 'pKa1' | 'pKa2';
  estimate: Estimate;
}

export interface PhPreview {
  requestPoints: CreatePhProfileInput['points'];
  fit: FitResult | PhBellFitResult | null;
  error: string | null;
  pkas: FittedPka[];
  optimum: Estimate | null;
  elapsedMs: number;
}

export const phModelNames: Record<PhModelName, string> = {
  bell: 'Bell-shaped (two ionizations)',
  acid: 'Acid limb (active when deprotonated)',
  base: 'Base limb (active when protonated)',
};

/**
 * The live fit of a pH series with shared/kinetics/fit-ph-profile, on the points the server will fit
 * (the included ones, in grid order, in the entered unit), with the pKa values named as the server stores
 * them and the pH optimum of a bell.
 *
 * @param points the grid's points (x = pH, y = rate)
 * @param model bell, acid or base
 * @returns the fit or why there is none, the pKa values, the optimum and the request points
 */
export function phPreview(points: readonly GridPoint[], model: PhModelName): PhPreview {
  const startedAt = performance.now();
  const requestPoints = points.map((point) => ({ ph: point.x, k: point.y, excluded: point.excluded }));
  const used = requestPoints.filter((point) => !point.excluded).map((point) => ({ ph: point.ph, k: point.k }));
  const done = (result: Omit<PhPreview, 'requestPoints' | 'elapsedMs'>): PhPreview => ({ ...result, requestPoints, elapsedMs: performance.now() - startedAt });
  let fit: FitResult | PhBellFitResult;
  try {
    fit = fitPhProfile(used, { model });
  } catch (error) {
    if (error instanceof KineticsInputError) return done({ fit: null, error: error.message, pkas: [], optimum: null });
    throw error;
  }
  if (!(fit.parameters.kmax.value > 0)) {
    // The server refuses such a fit with these words.
    return done({ fit, error: 'the fit gives a non-positive kmax, so the model does not describe these points', pkas: [], optimum: null });
  }
  const pkas: FittedPka[] =
    model === 'bell'
      ? [
          { parameter: 'pKa1', estimate: fit.parameters.pKa1 },
          { parameter: 'pKa2', estimate: fit.parameters.pKa2 },
        ]
      : [{ parameter: model === 'acid' ? 'pKa1' : 'pKa2', estimate: fit.parameters.pKa }];
  return done({ fit, error: null, pkas, optimum: 'phOptimum' in fit ? fit.phOptimum : null });
}

/** One annotated residue that might own a fitted pKa. */
export interface PkaCandidate {
  position: number;
  residue: string;
  roles: string[];
  freePka: number;
  shift: number;
  expectedPka: number | null;
}

/**
 * The annotated ionizable residues of the enzyme for each fitted pKa, nearest free-residue pKa first
 * (shared/kinetics/residue-pka), with a residue annotated in two roles counted once, as the server does.
 *
 * @param pkas the fitted pKa values
 * @param sites the enzyme's catalytic sites
 * @returns the candidates per pKa, in the order of `pkas`
 */
export function pkaCandidates(pkas: readonly FittedPka[], sites: readonly CatalyticSiteDto[]): PkaCandidate[][] {
  const residues = new Map<number, { position: number; residue: string; roles: string[]; expectedPka: number | null }>();
  for (const site of [...sites].sort((first, second) => first.position - second.position || first.role.localeCompare(second.role))) {
    const entry = residues.get(site.position);
    if (entry) {
      entry.roles.push(site.role);
      entry.expectedPka ??= site.expectedPka;
    } else {
      residues.set(site.position, { position: site.position, residue: site.residue, roles: [site.role], expectedPka: site.expectedPka });
    }
  }
  return matchResiduePkas(
    pkas.map((pka) => pka.estimate.value),
    [...residues.values()],
  ).map((assignment) => assignment.candidates);
}
