import type { DataSource, EntityManager } from 'typeorm';
import { can, type Role } from '@shared/auth/permissions';
import { toMolar, toPerMolarPerSecond, toPerSecond, type CreateMeasurementInput } from '@shared/schemas/assay';
import {
  reviewTransitions,
  type BulkReviewInput,
  type MeasurementDto,
  type MeasurementListQuery,
  type ReviewAction,
  type ReviewMeasurementInput,
} from '@shared/schemas/measurement';
import { HttpError, forbidden, notFound, staleVersion } from '../../http/errors';
import { writeTransaction } from '../../write-transaction';
import { Assay } from '../assays/assay.entity';
import { assayConditionColumns, loadVariantContext, type VariantContext } from '../assays/assay-conditions';
import { recordAudit } from '../audit/record-audit';
import { recomputeVariantSummaries } from '../comparisons/variant-summary';
import { Variant } from '../variants/variant.entity';
import { Measurement } from './measurement.entity';
import { completenessFor, measurementAuditType, measurementSnapshot, storedFlags, toMeasurementDto } from './measurement-dto';

/** Who acts on a measurement. */
export interface Actor {
  id: number;
  role: Role;
}

/** Audit entity type of assays (also written by the assays module). */
export const assayAuditType = 'assay';

/**
 * Stores a measurement entered as reported values: the assay row for its conditions (no rate points) and
 * the measurement (`entered`, in draft), converted to SI, with plausibility flags and STRENDA completeness,
 * in one transaction that also recomputes the variant's summary.
 *
 * kcat/Km, when not given, is kcat/Km with the relative errors of kcat and Km combined as independent; fits
 * give correlated kcat and Km, so this overstates its error, and a warning says so. For the Hill model no
 * kcat/Km is derived (kcat/K½ is no second-order rate constant unless n = 1).
 *
 * @param dataSource the data source
 * @param actorId who enters it
 * @param input the validated body
 * @throws {HttpError} 400 for an unknown variant
 * @returns the measurement DTO
 */
export async function createEnteredMeasurement(
  dataSource: DataSource,
  actorId: number,
  input: CreateMeasurementInput,
): Promise<MeasurementDto> {
  return writeTransaction(dataSource, async (manager) => {
    const context = await loadVariantContext(manager, input.variantId);
    const assay = await manager.getRepository(Assay).save(
      manager.getRepository(Assay).create({
        ...assayConditionColumns(input),
        variantId: context.variant.id,
        operatorId: actorId,
        sUnit: null,
        vUnit: null,
        replicateCount: input.replicateCount ?? 1,
        createdById: actorId,
      }),
    );

    const measurement = await manager
      .getRepository(Measurement)
      .save(manager.getRepository(Measurement).create(enteredMeasurementColumns(context, assay, input, actorId)));
    const campaignId = context.variant.campaignId;
    await recordAudit(manager, {
      actorId,
      entityType: assayAuditType,
      entityId: assay.id,
      campaignId,
      action: 'create',
      after: { id: assay.id, variantId: assay.variantId, substrate: assay.substrate, temperatureK: assay.temperatureK, ph: assay.ph, points: 0 },
    });
    await recordAudit(manager, {
      actorId,
      entityType: measurementAuditType,
      entityId: measurement.id,
      campaignId,
      action: 'create',
      after: measurementSnapshot(measurement),
    });
    await recomputeVariantSummaries(manager, campaignId, [context.variant.id]);
    return toMeasurementDto(measurement, assay, context.variant);
  });
}

/**
 * The column values of a measurement entered as reported values, as POST /api/measurements stores it:
 * kcat and Km (and kcat/Km, Ki, Hill n) converted to SI, kcat/Km derived from kcat and Km when not given
 * (with a warning, as their errors are taken as independent; not for the Hill model), plausibility flags
 * and STRENDA completeness; a draft. Imports build their rows with it too.
 *
 * @param context the variant with its campaign and enzyme
 * @param assay the saved assay row the measurement belongs to (id and condition columns)
 * @param input the validated body
 * @param actorId who enters it
 * @returns the columns of a new Measurement
 */
export function enteredMeasurementColumns(
  context: VariantContext,
  assay: Pick<Assay, 'id' | 'temperatureK' | 'ph' | 'bufferName' | 'bufferMolar' | 'metalSalt' | 'metalMolar' | 'enzymeMolar'>,
  input: CreateMeasurementInput,
  actorId: number,
): Partial<Measurement> {
  const kcat = { value: toPerSecond(input.kcat.value, input.kcat.unit), se: toPerSecond(input.kcat.se, input.kcat.unit) };
  const km = { value: toMolar(input.km.value, input.km.unit), se: toMolar(input.km.se, input.km.unit) };
  const warnings: string[] = [];
  let kcatOverKm: { value: number; se: number } | null = null;
  if (input.kcatOverKm) {
    kcatOverKm = {
      value: toPerMolarPerSecond(input.kcatOverKm.value, input.kcatOverKm.unit),
      se: toPerMolarPerSecond(input.kcatOverKm.se, input.kcatOverKm.unit),
    };
  } else if (input.model !== 'hill') {
    const value = kcat.value / km.value;
    kcatOverKm = { value, se: value * Math.hypot(kcat.se / kcat.value, km.se / km.value) };
    warnings.push(
      'kcat/Km was derived from kcat and Km with their errors taken as independent, which overstates its error when they came from one fit',
    );
  }
  const range = input.substrateRange
    ? { min: toMolar(input.substrateRange.min, input.substrateRange.unit), max: toMolar(input.substrateRange.max, input.substrateRange.unit) }
    : null;
  const fittingMethod = input.fittingMethod ?? null;
  const completeness = completenessFor(context, assay, {
    kcat,
    km,
    substrateMinMolar: range?.min ?? null,
    substrateMaxMolar: range?.max ?? null,
    replicateCount: input.replicateCount ?? null,
    model: input.model,
    fittingMethod,
  });

  return {
    assayId: assay.id,
    variantId: context.variant.id,
    source: 'entered',
    model: input.model,
    vmax: null,
    vmaxSe: null,
    kcat: kcat.value,
    kcatSe: kcat.se,
    km: km.value,
    kmSe: km.se,
    kcatOverKm: kcatOverKm?.value ?? null,
    kcatOverKmSe: kcatOverKm?.se ?? null,
    ki: input.ki ? toMolar(input.ki.value, input.ki.unit) : null,
    kiSe: input.ki ? toMolar(input.ki.se, input.ki.unit) : null,
    hillN: input.hill?.value ?? null,
    hillNSe: input.hill?.se ?? null,
    ci95: {},
    residualSd: null,
    degreesOfFreedom: null,
    pointCount: null,
    substrateMinMolar: range?.min ?? null,
    substrateMaxMolar: range?.max ?? null,
    fittingMethod,
    warnings,
    flags: storedFlags({ kcat, km, kcatOverKm, substrateMolar: range ? [range.min, range.max] : null }),
    completenessScore: completeness.score,
    completenessMissing: completeness.missing,
    reviewState: 'draft',
    reviewReason: null,
    reviewedById: null,
    reviewedAt: null,
    supersededById: null,
    createdById: actorId,
  };
}

/**
 * Measurements for the Review page, newest first, filtered by campaign, variant and review states.
 *
 * @param dataSource the data source
 * @param query the validated query
 * @returns one page of DTOs and the total count
 */
export async function listMeasurements(
  dataSource: DataSource,
  query: MeasurementListQuery,
): Promise<{ items: MeasurementDto[]; total: number; page: number; pageSize: number }> {
  const builder = dataSource
    .getRepository(Measurement)
    .createQueryBuilder('m')
    .innerJoinAndSelect('m.assay', 'a')
    .innerJoinAndSelect('m.variant', 'v');
  if (query.campaignId !== undefined) builder.andWhere('v.campaignId = :campaignId', { campaignId: query.campaignId });
  if (query.variantId !== undefined) builder.andWhere('m.variantId = :variantId', { variantId: query.variantId });
  if (query.reviewState !== undefined) builder.andWhere('m.reviewState IN (:...states)', { states: query.reviewState });
  const [rows, total] = await builder
    .orderBy('m.createdAt', 'DESC')
    .addOrderBy('m.id', 'DESC')
    .skip((query.page - 1) * query.pageSize)
    .take(query.pageSize)
    .getManyAndCount();
  return {
    items: rows.map((row) => toMeasurementDto(row, row.assay, row.variant)),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

/**
 * One measurement with its conditions; 404 when there is none.
 *
 * @param dataSource the data source
 * @param id the measurement id
 * @returns the DTO
 */
export async function getMeasurement(dataSource: DataSource, id: number): Promise<MeasurementDto> {
  const measurement = await loadWithRelations(dataSource.manager, id);
  if (!measurement) throw notFound('The measurement');
  return toMeasurementDto(measurement, measurement.assay, measurement.variant);
}

/**
 * Applies one review action (submit, approve, flag, retract) to a measurement, refusing a stale version
 * (409 `stale_version`), a transition the state machine does not allow (409 `invalid_transition`, naming
 * the current state) and an approval or flag by someone without the review permission (403). Recomputes
 * the variant's summary, since flagging or retracting takes the measurement out of the comparisons.
 *
 * @param dataSource the data source
 * @param actor who reviews
 * @param id the measurement id
 * @param input version, action and reason
 * @returns the updated DTO
 */
export async function reviewMeasurement(
  dataSource: DataSource,
  actor: Actor,
  id: number,
  input: ReviewMeasurementInput,
): Promise<MeasurementDto> {
  return writeTransaction(dataSource, async (manager) => {
    const measurement = await loadWithRelations(manager, id);
    if (!measurement) throw notFound('The measurement');
    const updated = await applyReview(manager, actor, measurement, input.version, input.action, input.reason);
    await recomputeVariantSummaries(manager, measurement.variant.campaignId, [measurement.variantId]);
    return toMeasurementDto(updated, measurement.assay, measurement.variant);
  });
}

/**
 * Applies one review action to several measurements in one transaction: all change or none (the first stale
 * version, invalid transition or unknown id rolls everything back and is named in the error).
 *
 * @param dataSource the data source
 * @param actor who reviews
 * @param input items (id and version), action and reason
 * @returns the updated DTOs, in the order of the items
 */
export async function bulkReviewMeasurements(
  dataSource: DataSource,
  actor: Actor,
  input: BulkReviewInput,
): Promise<MeasurementDto[]> {
  return writeTransaction(dataSource, async (manager) => {
    const results: MeasurementDto[] = [];
    const touched = new Map<number, Set<number>>();
    for (const [index, item] of input.items.entries()) {
      const measurement = await loadWithRelations(manager, item.id);
      if (!measurement) {
        throw new HttpError(404, 'not_found', `Measurement ${item.id} (item ${index + 1}) was not found; nothing was changed.`, {
          [`items.${index}.id`]: 'no such measurement',
        });
      }
      const updated = await applyReview(manager, actor, measurement, item.version, input.action, input.reason, index);
      results.push(toMeasurementDto(updated, measurement.assay, measurement.variant));
      const campaignVariants = touched.get(measurement.variant.campaignId) ?? new Set<number>();
      campaignVariants.add(measurement.variantId);
      touched.set(measurement.variant.campaignId, campaignVariants);
    }
    for (const [campaignId, variantIds] of touched) {
      await recomputeVariantSummaries(manager, campaignId, [...variantIds]);
    }
    return results;
  });
}

const PAST_TENSE: Record<ReviewAction, string> = {
  submit: 'submitted',
  approve: 'approved',
  flag: 'flagged',
  retract: 'retracted',
};

async function applyReview(
  manager: EntityManager,
  actor: Actor,
  measurement: Measurement & { variant: Variant; assay: Assay },
  expectedVersion: number,
  action: ReviewAction,
  reason: string | null,
  itemIndex?: number,
): Promise<Measurement> {
  const label = `Measurement ${measurement.id}`;
  const inItem = itemIndex === undefined ? '' : ` (item ${itemIndex + 1}); nothing was changed`;
  if ((action === 'approve' || action === 'flag') && !can(actor.role, 'measurements:review')) {
    throw forbidden(`Only a lead or an admin may ${action} measurements.`);
  }
  if (measurement.version !== expectedVersion) {
    const stale = staleVersion(label, measurement.version);
    if (itemIndex === undefined) throw stale;
    throw new HttpError(409, stale.code, `${stale.message.replace(/\.$/, '')}${inItem}.`, { [`items.${itemIndex}.version`]: 'is stale' }, {
      ...stale.details,
      id: measurement.id,
    });
  }
  if (measurement.supersededById !== null && action !== 'retract') {
    throw new HttpError(
      409,
      'invalid_transition',
      `${label} was superseded by measurement ${measurement.supersededById} (a refit); review the newer one${inItem}.`,
      undefined,
      { currentState: measurement.reviewState, supersededById: measurement.supersededById },
    );
  }
  const transition = reviewTransitions[action];
  if (!transition.from.includes(measurement.reviewState)) {
    const allowed = transition.from.join(' or ');
    throw new HttpError(
      409,
      'invalid_transition',
      `${label} is ${measurement.reviewState}; only ${allowed} measurements can be ${PAST_TENSE[action]}${inItem}.`,
      undefined,
      { currentState: measurement.reviewState },
    );
  }

  const before = measurementSnapshot(measurement);
  measurement.reviewState = transition.to;
  measurement.reviewReason = reason;
  if (action !== 'submit') {
    measurement.reviewedById = actor.id;
    measurement.reviewedAt = new Date();
  }
  // save() would also write the loaded relations; only the measurement's own columns change here.
  const { variant, assay, ...columns } = measurement;
  const saved = await manager.getRepository(Measurement).save(manager.getRepository(Measurement).create(columns));
  const updated = Object.assign(saved, { variant, assay });
  await recordAudit(manager, {
    actorId: actor.id,
    entityType: measurementAuditType,
    entityId: measurement.id,
    campaignId: variant.campaignId,
    action,
    before,
    after: measurementSnapshot(updated),
  });
  return updated;
}

async function loadWithRelations(
  manager: EntityManager,
  id: number,
): Promise<(Measurement & { variant: Variant; assay: Assay }) | null> {
  return manager.getRepository(Measurement).findOne({ where: { id }, relations: { assay: true, variant: true } });
}
