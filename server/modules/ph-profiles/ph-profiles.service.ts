import type { DataSource, EntityManager } from 'typeorm';
import { KineticsInputError } from '@shared/kinetics/kinetics-input-error';
import { fitPhProfile, type PhBellFitResult } from '@shared/kinetics/fit-ph-profile';
import { matchResiduePkas } from '@shared/kinetics/residue-pka';
import type { FitResult } from '@shared/kinetics/types';
import { phRateSiUnit, phRateToSi, type CreatePhProfileInput, type PhProfileDto, type PkaReadingDto } from '@shared/schemas/ph-profile';
import { badRequest, notFound } from '../../http/errors';
import { writeTransaction } from '../../write-transaction';
import { ZERO_CELSIUS_KELVIN, loadVariantContext, roundCelsius } from '../assays/assay-conditions';
import { recordAudit } from '../audit/record-audit';
import { recomputeVariantSummaries } from '../comparisons/variant-summary';
import { CatalyticSite } from '../enzymes/catalytic-site.entity';
import { Variant } from '../variants/variant.entity';
import { PhProfile } from './ph-profile.entity';

/** Audit entity type of pH profiles. */
export const phProfileAuditType = 'ph-profile';

/**
 * Fits and stores a pH–rate profile. The fit runs in the entered unit (as the live preview does) on the
 * points that are not excluded; kmax and the residual SD are then converted to the rate kind's SI unit
 * (one exact factor), and the points are stored in SI with their exclusion marks. The acidic-limb pKa is
 * stored as pKa1 and the basic-limb pKa as pKa2, for the single-limb models too. Recomputes the variant's
 * summary (its pH optimum) in the same transaction.
 *
 * @param dataSource the data source
 * @param actorId who enters it
 * @param input the validated body
 * @throws {HttpError} 400 for an unknown variant, points the engine refuses or a non-positive kmax
 * @returns the profile with its pKa reading
 */
export async function createPhProfile(dataSource: DataSource, actorId: number, input: CreatePhProfileInput): Promise<PhProfileDto> {
  return writeTransaction(dataSource, async (manager) => {
    const context = await loadVariantContext(manager, input.variantId);
    const profile = await manager.getRepository(PhProfile).save(manager.getRepository(PhProfile).create(phProfileColumns(input, actorId)));
    await recordAudit(manager, {
      actorId,
      entityType: phProfileAuditType,
      entityId: profile.id,
      campaignId: context.variant.campaignId,
      action: 'create',
      after: {
        id: profile.id,
        variantId: profile.variantId,
        model: profile.model,
        rateKind: profile.rateKind,
        pka1: profile.pka1,
        pka2: profile.pka2,
        phOptimum: profile.phOptimum,
        points: profile.points.length,
      },
    });
    await recomputeVariantSummaries(manager, context.variant.campaignId, [context.variant.id]);
    return toPhProfileDto(profile, context.variant, await pkaReading(manager, context.campaign.enzymeId, profile));
  });
}

/**
 * Fits a pH–rate profile as POST /api/ph-profiles does and returns the columns of the profile to store: the
 * fit runs in the entered unit on the points that are not excluded; kmax and the residual SD are converted to
 * the rate kind's SI unit (one exact factor) and the points are stored in SI with their exclusion marks; the
 * acidic-limb pKa is pKa1 and the basic-limb pKa pKa2. Imports build their rows with it too.
 *
 * @param input the validated body (its variant must exist)
 * @param actorId who enters it
 * @throws {HttpError} 400 for points the engine refuses or a non-positive kmax
 * @returns the columns of a new PhProfile
 */
export function phProfileColumns(input: CreatePhProfileInput, actorId: number): Partial<PhProfile> {
  const used = input.points.filter((point) => !point.excluded).map((point) => ({ ph: point.ph, k: point.k }));
  let fit: FitResult | PhBellFitResult;
  try {
    fit = fitPhProfile(used, { model: input.model });
  } catch (error) {
    if (error instanceof KineticsInputError) throw badRequest(`The points cannot be fitted: ${error.message}.`, { points: error.message });
    throw error;
  }
  const kmax = fit.parameters.kmax;
  if (!(kmax.value > 0)) {
    const message = 'the fit gives a non-positive kmax, so the model does not describe these points';
    throw badRequest(`The points cannot be fitted: ${message}.`, { points: message });
  }
  const factor = phRateToSi(1, input.rateKind, input.unit);
  const acidic = input.model === 'bell' ? fit.parameters.pKa1 : input.model === 'acid' ? fit.parameters.pKa : null;
  const basic = input.model === 'bell' ? fit.parameters.pKa2 : input.model === 'base' ? fit.parameters.pKa : null;
  const optimum = 'phOptimum' in fit ? fit.phOptimum : null;
  return {
    variantId: input.variantId,
    substrate: input.substrate,
    temperatureK: input.temperatureC + ZERO_CELSIUS_KELVIN,
    rateKind: input.rateKind,
    model: input.model,
    points: input.points.map((point) => ({ ph: point.ph, k: phRateToSi(point.k, input.rateKind, input.unit), excluded: point.excluded })),
    pka1: acidic?.value ?? null,
    pka1Se: acidic?.se ?? null,
    pka2: basic?.value ?? null,
    pka2Se: basic?.se ?? null,
    kMax: kmax.value * factor,
    kMaxSe: kmax.se * factor,
    phOptimum: optimum?.value ?? null,
    phOptimumSe: optimum?.se ?? null,
    residualSd: fit.residualSd * factor,
    degreesOfFreedom: fit.df,
    warnings: fit.warnings,
    createdById: actorId,
  };
}

/**
 * The pH profiles of a variant, newest first (without the pKa reading).
 *
 * @param dataSource the data source
 * @param variantId the variant
 * @returns the DTOs
 */
export async function listPhProfiles(dataSource: DataSource, variantId: number): Promise<PhProfileDto[]> {
  const variant = await dataSource.getRepository(Variant).findOneBy({ id: variantId });
  if (!variant) return [];
  const profiles = await dataSource.getRepository(PhProfile).find({ where: { variantId }, order: { id: 'DESC' } });
  return profiles.map((profile) => toPhProfileDto(profile, variant, undefined));
}

/**
 * One pH profile with its pKa reading: each fitted pKa set against the ionizable residues annotated on the
 * campaign's enzyme, with their free-residue pKa and the shift; 404 when there is none.
 *
 * @param dataSource the data source
 * @param id the profile id
 * @returns the DTO with `pkaReading`
 */
export async function getPhProfile(dataSource: DataSource, id: number): Promise<PhProfileDto> {
  const profile = await dataSource.getRepository(PhProfile).findOne({ where: { id }, relations: { variant: { campaign: true } } });
  if (!profile) throw notFound('The pH profile');
  return toPhProfileDto(profile, profile.variant, await pkaReading(dataSource.manager, profile.variant.campaign.enzymeId, profile));
}

async function pkaReading(manager: EntityManager, enzymeId: number, profile: PhProfile): Promise<PkaReadingDto[]> {
  const sites = await manager.getRepository(CatalyticSite).find({ where: { enzymeId }, order: { position: 'ASC', role: 'ASC' } });
  // Sites are stored per (position, role); a residue with two roles is still one candidate.
  const residues = new Map<number, { position: number; residue: string; roles: string[]; expectedPka: number | null }>();
  for (const site of sites) {
    const entry = residues.get(site.position);
    if (entry) {
      entry.roles.push(site.role);
      entry.expectedPka ??= site.expectedPka;
    } else {
      residues.set(site.position, { position: site.position, residue: site.residue, roles: [site.role], expectedPka: site.expectedPka });
    }
  }
  const fitted: { parameter: 'pKa1' | 'pKa2'; value: number; se: number | null }[] = [];
  if (profile.pka1 !== null) fitted.push({ parameter: 'pKa1', value: profile.pka1, se: finiteOrNull(profile.pka1Se) });
  if (profile.pka2 !== null) fitted.push({ parameter: 'pKa2', value: profile.pka2, se: finiteOrNull(profile.pka2Se) });
  const assignments = matchResiduePkas(
    fitted.map((entry) => entry.value),
    [...residues.values()],
  );
  return assignments.map((assignment, index) => ({
    parameter: fitted[index].parameter,
    pKa: assignment.pKa,
    se: fitted[index].se,
    candidates: assignment.candidates.map((candidate) => ({
      position: candidate.position,
      residue: candidate.residue,
      roles: candidate.roles,
      freePka: candidate.freePka,
      shift: candidate.shift,
      expectedPka: candidate.expectedPka,
    })),
  }));
}

function toPhProfileDto(profile: PhProfile, variant: Variant, reading: PkaReadingDto[] | undefined): PhProfileDto {
  const unit = phRateSiUnit[profile.rateKind];
  const dto: PhProfileDto = {
    id: profile.id,
    variant: { id: variant.id, label: variant.label, campaignId: variant.campaignId },
    substrate: profile.substrate,
    temperatureC: roundCelsius(profile.temperatureK - ZERO_CELSIUS_KELVIN),
    rateKind: profile.rateKind,
    unit,
    model: profile.model,
    points: profile.points.map((point) => ({ ph: point.ph, k: point.k, excluded: point.excluded === true })),
    pKa1: profile.pka1 === null ? null : { value: profile.pka1, se: finiteOrNull(profile.pka1Se) },
    pKa2: profile.pka2 === null ? null : { value: profile.pka2, se: finiteOrNull(profile.pka2Se) },
    kMax: { value: profile.kMax, se: finiteOrNull(profile.kMaxSe), unit },
    phOptimum: profile.phOptimum === null ? null : { value: profile.phOptimum, se: finiteOrNull(profile.phOptimumSe) },
    residualSd: profile.residualSd,
    degreesOfFreedom: profile.degreesOfFreedom,
    warnings: profile.warnings,
    createdById: profile.createdById,
    createdAt: profile.createdAt.toISOString(),
    version: profile.version,
  };
  if (reading !== undefined) dto.pkaReading = reading;
  return dto;
}

function finiteOrNull(value: number | null): number | null {
  return value !== null && Number.isFinite(value) ? value : null;
}
