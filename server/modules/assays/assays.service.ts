import { In, IsNull, type DataSource, type EntityManager } from 'typeorm';
import { fitAssay, type AssayFit } from '@shared/assay/fit-assay';
import { KineticsInputError } from '@shared/kinetics/kinetics-input-error';
import {
  fromMolar,
  fromMolarPerSecond,
  toMolar,
  toMolarPerSecond,
  type AssayDto,
  type AssayListQuery,
  type ConcentrationUnitInput,
  type CreateAssayInput,
  type KineticModelName,
  type RateUnitInput,
  type RatePointDto,
  type RefitAssayInput,
} from '@shared/schemas/assay';
import type { MeasurementDto } from '@shared/schemas/measurement';
import { HttpError, badRequest, notFound, staleVersion } from '../../http/errors';
import { writeTransaction } from '../../write-transaction';
import { recordAudit } from '../audit/record-audit';
import { recomputeVariantSummaries } from '../comparisons/variant-summary';
import { Measurement } from '../measurements/measurement.entity';
import { completenessFor, measurementAuditType, measurementSnapshot, storedFlags, toMeasurementDto } from '../measurements/measurement-dto';
import { assayAuditType } from '../measurements/measurements.service';
import { Variant } from '../variants/variant.entity';
import { Assay } from './assay.entity';
import { assayConditionColumns, loadVariantContext, toAssayConditionsDto, type VariantContext } from './assay-conditions';
import { RatePoint } from './rate-point.entity';

// Rows per INSERT of rate points: 7 columns a row keeps a statement far below SQLite's parameter limit.
const POINT_INSERT_BATCH = 1000;

const MODEL_NAMES: Record<KineticModelName, string> = {
  'michaelis-menten': 'Michaelis–Menten',
  'substrate-inhibition': 'substrate inhibition',
  hill: 'Hill',
};

/**
 * Stores an assay with its rate points (converted to M and M s⁻¹), fits the chosen model on the server to
 * the points that are not excluded (kcat = Vmax/[E]t), and stores the measurement (`fitted`, draft) with its
 * warnings, plausibility flags and STRENDA completeness, all in one transaction that also recomputes the
 * variant's summary. A fit the engine refuses, or one that gives a non-positive parameter, is a 400 and
 * writes nothing.
 *
 * @param dataSource the data source
 * @param actorId who enters it
 * @param input the validated body
 * @returns the assay (with points) and its measurement
 */
export async function createAssay(
  dataSource: DataSource,
  actorId: number,
  input: CreateAssayInput,
): Promise<{ assay: AssayDto; measurement: MeasurementDto }> {
  return writeTransaction(dataSource, async (manager) => {
    const context = await loadVariantContext(manager, input.variantId);
    const fit = runFit(input.points, input.model, input.sUnit, input.vUnit, input.enzymeConcentration);
    const assay = await manager.getRepository(Assay).save(
      manager.getRepository(Assay).create({
        ...assayConditionColumns(input),
        variantId: context.variant.id,
        operatorId: actorId,
        sUnit: input.sUnit,
        vUnit: input.vUnit,
        replicateCount: new Set(input.points.map((point) => point.replicate)).size,
        createdById: actorId,
      }),
    );
    const points = input.points.map((point) => ({
      assayId: assay.id,
      substrateMolar: toMolar(point.s, input.sUnit),
      rateMolarPerSecond: toMolarPerSecond(point.v, input.vUnit),
      replicate: point.replicate,
      excluded: point.excluded,
      exclusionReason: point.excluded ? point.exclusionReason : null,
    }));
    for (let start = 0; start < points.length; start += POINT_INSERT_BATCH) {
      // updateEntity(false): TypeORM would otherwise re-read the inserted rows' defaults with one OR term
      // per row, which SQLite refuses beyond 1,000 terms.
      await manager
        .createQueryBuilder()
        .insert()
        .into(RatePoint)
        .values(points.slice(start, start + POINT_INSERT_BATCH))
        .updateEntity(false)
        .execute();
    }
    const measurement = await saveFittedMeasurement(manager, actorId, context, assay, fit);
    const campaignId = context.variant.campaignId;
    await recordAudit(manager, {
      actorId,
      entityType: assayAuditType,
      entityId: assay.id,
      campaignId,
      action: 'create',
      after: {
        id: assay.id,
        variantId: assay.variantId,
        substrate: assay.substrate,
        temperatureK: assay.temperatureK,
        ph: assay.ph,
        points: points.length,
        excludedPoints: points.filter((point) => point.excluded).length,
      },
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
    const dto = await loadAssayDto(manager, assay.id, true);
    return { assay: dto, measurement: dto.measurements[0] };
  });
}

/**
 * Refits a stored assay with another model and/or changed point exclusions. The points keep their values
 * (only the exclusion marks change); the assay's current measurement is superseded by the new one, which
 * starts as a draft; nothing is deleted. A stale assay version is a 409.
 *
 * @param dataSource the data source
 * @param actorId who refits
 * @param id the assay id
 * @param input version, model and exclusions
 * @returns the assay (with points) and the new measurement
 */
export async function refitAssay(
  dataSource: DataSource,
  actorId: number,
  id: number,
  input: RefitAssayInput,
): Promise<{ assay: AssayDto; measurement: MeasurementDto }> {
  return writeTransaction(dataSource, async (manager) => {
    const assay = await manager.getRepository(Assay).findOneBy({ id });
    if (!assay) throw notFound('The assay');
    if (assay.version !== input.version) throw staleVersion('This assay', assay.version);
    const stored = await manager.getRepository(RatePoint).find({ where: { assayId: id }, order: { id: 'ASC' } });
    if (stored.length === 0 || assay.sUnit === null || assay.vUnit === null || assay.enzymeMolar === null) {
      throw new HttpError(409, 'conflict', `Assay ${id} has no rate points to refit (its measurement was entered as reported values).`);
    }
    const current = await manager.getRepository(Measurement).findOne({
      where: { assayId: id, supersededById: IsNull() },
      order: { id: 'DESC' },
    });
    const byId = new Map(stored.map((point) => [point.id, point]));
    const changed: RatePoint[] = [];
    input.points.forEach((change, index) => {
      const point = byId.get(change.id);
      if (!point) throw badRequest(`Point ${change.id} is not a point of assay ${id}.`, { [`points.${index}.id`]: `is not a point of assay ${id}` });
      const reason = change.excluded ? change.exclusionReason : null;
      if (point.excluded !== change.excluded || point.exclusionReason !== reason) {
        point.excluded = change.excluded;
        point.exclusionReason = reason;
        changed.push(point);
      }
    });

    const sUnit = assay.sUnit as ConcentrationUnitInput;
    const vUnit = assay.vUnit as RateUnitInput;
    const enzymeUnit = (assay.enzymeUnit ?? 'M') as ConcentrationUnitInput;
    const model = input.model ?? current?.model ?? 'michaelis-menten';
    const fit = runFit(
      stored.map((point) => ({
        s: fromMolar(point.substrateMolar, sUnit),
        v: fromMolarPerSecond(point.rateMolarPerSecond, vUnit),
        excluded: point.excluded,
      })),
      model,
      sUnit,
      vUnit,
      { value: fromMolar(assay.enzymeMolar, enzymeUnit), unit: enzymeUnit },
    );
    for (const point of changed) {
      await manager.update(RatePoint, { id: point.id }, { excluded: point.excluded, exclusionReason: point.exclusionReason });
    }
    const variant = await manager.getRepository(Variant).findOneByOrFail({ id: assay.variantId });
    const context = await loadVariantContext(manager, variant.id);
    const measurement = await saveFittedMeasurement(manager, actorId, context, assay, fit);
    if (current) {
      const before = measurementSnapshot(current);
      current.supersededById = measurement.id;
      const saved = await manager.getRepository(Measurement).save(current);
      await recordAudit(manager, {
        actorId,
        entityType: measurementAuditType,
        entityId: current.id,
        campaignId: variant.campaignId,
        action: 'supersede',
        before,
        after: measurementSnapshot(saved),
      });
    }
    // The assay's own columns do not change, but its points and measurement did: the version says so.
    await manager.query(`UPDATE assays SET version = version + 1, updated_at = ? WHERE id = ?`, [
      new Date().toISOString().replace('T', ' ').replace('Z', ''),
      id,
    ]);
    await recordAudit(manager, {
      actorId,
      entityType: assayAuditType,
      entityId: id,
      campaignId: variant.campaignId,
      action: 'refit',
      before: { model: current?.model ?? null, measurementId: current?.id ?? null, version: assay.version },
      after: {
        model,
        measurementId: measurement.id,
        version: assay.version + 1,
        excludedPointIds: stored.filter((point) => point.excluded).map((point) => point.id),
      },
    });
    await recomputeVariantSummaries(manager, variant.campaignId, [variant.id]);
    const dto = await loadAssayDto(manager, id, true);
    return { assay: dto, measurement: dto.measurements.find((item) => item.id === measurement.id)! };
  });
}

/**
 * One assay with its points (in SI and in the entered units) and measurements; 404 when there is none.
 *
 * @param dataSource the data source
 * @param id the assay id
 * @returns the DTO
 */
export async function getAssay(dataSource: DataSource, id: number): Promise<AssayDto> {
  return loadAssayDto(dataSource.manager, id, true);
}

/**
 * Assays of a variant or campaign, newest first, without their points.
 *
 * @param dataSource the data source
 * @param query variantId and/or campaignId, page and pageSize
 * @returns a page of DTOs and the total
 */
export async function listAssays(
  dataSource: DataSource,
  query: AssayListQuery,
): Promise<{ items: AssayDto[]; total: number; page: number; pageSize: number }> {
  const builder = dataSource.getRepository(Assay).createQueryBuilder('a').innerJoinAndSelect('a.variant', 'v');
  if (query.variantId !== undefined) builder.andWhere('a.variantId = :variantId', { variantId: query.variantId });
  if (query.campaignId !== undefined) builder.andWhere('v.campaignId = :campaignId', { campaignId: query.campaignId });
  const [assays, total] = await builder
    .orderBy('a.assayDate', 'DESC')
    .addOrderBy('a.id', 'DESC')
    .skip((query.page - 1) * query.pageSize)
    .take(query.pageSize)
    .getManyAndCount();
  const ids = assays.map((assay) => assay.id);
  const measurements = ids.length === 0 ? [] : await dataSource.getRepository(Measurement).find({ where: { assayId: In(ids) }, order: { id: 'DESC' } });
  const counts = await pointCounts(dataSource.manager, ids);
  return {
    items: assays.map((assay) =>
      assayDto(
        assay,
        assay.variant,
        measurements.filter((measurement) => measurement.assayId === assay.id),
        counts.get(assay.id) ?? 0,
        undefined,
      ),
    ),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

/**
 * Fits an assay's points as entered with the chosen model, turning what the engine refuses, and a fit with
 * a non-positive parameter, into a 400 on `points`.
 *
 * @param points the points in `sUnit` and `vUnit`, with exclusion marks
 * @param model the kinetic model
 * @param sUnit unit of S
 * @param vUnit unit of v
 * @param enzymeConcentration [E]t with its unit
 * @throws {HttpError} 400 when the points cannot be fitted
 * @returns the fit in SI units
 */
export function runFit(
  points: readonly { s: number; v: number; excluded: boolean }[],
  model: KineticModelName,
  sUnit: ConcentrationUnitInput,
  vUnit: RateUnitInput,
  enzymeConcentration: { value: number; unit: ConcentrationUnitInput },
): AssayFit {
  let fit: AssayFit;
  try {
    fit = fitAssay(points, { model, sUnit, vUnit, enzymeConcentration });
  } catch (error) {
    if (error instanceof KineticsInputError) throw badRequest(`The points cannot be fitted: ${error.message}.`, { points: error.message });
    throw error;
  }
  if (fit.nonPositive.length > 0) {
    const message = `the ${MODEL_NAMES[model]} fit gives a non-positive ${fit.nonPositive.join(' and ')}, so the model does not describe these points; exclude outliers or choose another model`;
    throw badRequest(`The points cannot be fitted: ${message}.`, { points: message });
  }
  return fit;
}

async function saveFittedMeasurement(
  manager: EntityManager,
  actorId: number,
  context: VariantContext,
  assay: Assay,
  fit: AssayFit,
): Promise<Measurement> {
  return manager.getRepository(Measurement).save(manager.getRepository(Measurement).create(fittedMeasurementColumns(context, assay, fit, actorId)));
}

/**
 * The column values of a measurement fitted from an assay's rate points, as POST /api/assays stores it:
 * the fit's parameters in SI with their errors and 95 % intervals, the substrate range of the fitted
 * points, plausibility flags and STRENDA completeness; a draft. Imports build their rows with it too.
 *
 * @param context the variant with its campaign and enzyme
 * @param assay the saved assay row (id, variant, condition columns, replicate count)
 * @param fit the fit from {@link runFit}
 * @param actorId who fits it
 * @returns the columns of a new Measurement
 */
export function fittedMeasurementColumns(
  context: VariantContext,
  assay: Pick<Assay, 'id' | 'variantId' | 'temperatureK' | 'ph' | 'bufferName' | 'bufferMolar' | 'metalSalt' | 'metalMolar' | 'enzymeMolar' | 'replicateCount'>,
  fit: AssayFit,
  actorId: number,
): Partial<Measurement> {
  const { parameters } = fit;
  // A loop, not Math.min(...values): an assay may carry more points than a call takes arguments.
  let substrateMin = Number.POSITIVE_INFINITY;
  let substrateMax = Number.NEGATIVE_INFINITY;
  for (const s of fit.substrateMolar) {
    substrateMin = Math.min(substrateMin, s);
    substrateMax = Math.max(substrateMax, s);
  }
  const fittingMethod = `${MODEL_NAMES[fit.model]} model, nonlinear least squares (Levenberg–Marquardt), unweighted, ${fit.pointCount} points`;
  const completeness = completenessFor(context, assay, {
    kcat: parameters.kcat,
    km: parameters.km,
    substrateMinMolar: substrateMin,
    substrateMaxMolar: substrateMax,
    replicateCount: assay.replicateCount,
    model: fit.model,
    fittingMethod,
  });
  const ci95: Record<string, [number, number]> = {
    vmax: parameters.vmax.ci95,
    km: parameters.km.ci95,
    kcat: parameters.kcat.ci95,
  };
  if (parameters.kcatOverKm) ci95.kcatOverKm = parameters.kcatOverKm.ci95;
  if (parameters.ki) ci95.ki = parameters.ki.ci95;
  if (parameters.hill) ci95.hill = parameters.hill.ci95;
  return {
    assayId: assay.id,
    variantId: assay.variantId,
    source: 'fitted',
    model: fit.model,
    vmax: parameters.vmax.value,
    vmaxSe: parameters.vmax.se,
    kcat: parameters.kcat.value,
    kcatSe: parameters.kcat.se,
    km: parameters.km.value,
    kmSe: parameters.km.se,
    kcatOverKm: parameters.kcatOverKm?.value ?? null,
    kcatOverKmSe: parameters.kcatOverKm?.se ?? null,
    ki: parameters.ki?.value ?? null,
    kiSe: parameters.ki?.se ?? null,
    hillN: parameters.hill?.value ?? null,
    hillNSe: parameters.hill?.se ?? null,
    ci95,
    residualSd: fit.residualSdMolarPerSecond,
    degreesOfFreedom: fit.degreesOfFreedom,
    pointCount: fit.pointCount,
    substrateMinMolar: substrateMin,
    substrateMaxMolar: substrateMax,
    fittingMethod,
    warnings: fit.warnings,
    flags: storedFlags({
      kcat: parameters.kcat,
      km: parameters.km,
      kcatOverKm: parameters.kcatOverKm,
      substrateMolar: fit.substrateMolar,
    }),
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

async function pointCounts(manager: EntityManager, assayIds: readonly number[]): Promise<Map<number, number>> {
  if (assayIds.length === 0) return new Map();
  const rows = (await manager.query(
    `SELECT assay_id, COUNT(*) AS n FROM rate_points WHERE assay_id IN (${assayIds.map(() => '?').join(', ')}) GROUP BY assay_id`,
    [...assayIds],
  )) as { assay_id: number; n: number }[];
  return new Map(rows.map((row) => [row.assay_id, row.n]));
}

async function loadAssayDto(manager: EntityManager, id: number, withPoints: boolean): Promise<AssayDto> {
  const assay = await manager.getRepository(Assay).findOne({ where: { id }, relations: { variant: true } });
  if (!assay) throw notFound('The assay');
  const measurements = await manager.getRepository(Measurement).find({ where: { assayId: id }, order: { id: 'DESC' } });
  const points = withPoints ? await manager.getRepository(RatePoint).find({ where: { assayId: id }, order: { id: 'ASC' } }) : [];
  return assayDto(assay, assay.variant, measurements, points.length, withPoints ? points : undefined);
}

function assayDto(
  assay: Assay,
  variant: Variant,
  measurements: readonly Measurement[],
  pointCount: number,
  points: readonly RatePoint[] | undefined,
): AssayDto {
  const sUnit = assay.sUnit as ConcentrationUnitInput | null;
  const vUnit = assay.vUnit as RateUnitInput | null;
  // The current measurement first, so that a page showing one measurement per assay takes the first.
  const ordered = [...measurements].sort(
    (first, second) => Number(first.supersededById !== null) - Number(second.supersededById !== null) || second.id - first.id,
  );
  const current = ordered.find((measurement) => measurement.supersededById === null) ?? null;
  const dto: AssayDto = {
    id: assay.id,
    variant: { id: variant.id, label: variant.label, campaignId: variant.campaignId },
    conditions: toAssayConditionsDto(assay),
    sUnit,
    vUnit,
    replicateCount: assay.replicateCount,
    notes: assay.notes,
    pointCount,
    measurements: ordered.map((measurement) => toMeasurementDto(measurement, assay, variant)),
    currentMeasurementId: current?.id ?? null,
    createdById: assay.createdById,
    createdAt: assay.createdAt.toISOString(),
    updatedAt: assay.updatedAt.toISOString(),
    version: assay.version,
  };
  if (points !== undefined) {
    dto.points = points.map(
      (point): RatePointDto => ({
        id: point.id,
        replicate: point.replicate,
        excluded: point.excluded,
        exclusionReason: point.exclusionReason,
        substrateMolar: point.substrateMolar,
        rateMolarPerSecond: point.rateMolarPerSecond,
        s: sUnit ? fromMolar(point.substrateMolar, sUnit) : point.substrateMolar,
        v: vUnit ? fromMolarPerSecond(point.rateMolarPerSecond, vUnit) : point.rateMolarPerSecond,
      }),
    );
  }
  return dto;
}
