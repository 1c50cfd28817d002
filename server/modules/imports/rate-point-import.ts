import { In, IsNull } from 'typeorm';
import type { AssayFit } from '@shared/assay/fit-assay';
import { createAssayInput, toMolar, toMolarPerSecond, type CreateAssayInput } from '@shared/schemas/assay';
import type { ImportPreviewRowDto } from '@shared/schemas/import';
import { HttpError } from '../../http/errors';
import { assayConditionColumns, ZERO_CELSIUS_KELVIN } from '../assays/assay-conditions';
import { Assay } from '../assays/assay.entity';
import { fittedMeasurementColumns, runFit } from '../assays/assays.service';
import { RatePoint } from '../assays/rate-point.entity';
import type { AuditEntry } from '../audit/record-audit';
import { recomputeVariantSummaries } from '../comparisons/variant-summary';
import { measurementAuditType, measurementSnapshot } from '../measurements/measurement-dto';
import { Measurement } from '../measurements/measurement.entity';
import { assayAuditType } from '../measurements/measurements.service';
import {
  assayAuditForm,
  assayKey,
  conditionFieldKeys,
  conditionFieldOfPath,
  conditionInput,
  loadStoredAssays,
  readConditions,
  sameConditions,
  type ConditionValues,
  type StoredAssay,
} from './assay-rows';
import { queryByIds, type VariantInfo } from './import-lookups';
import { insertAuditEvents, insertEntities } from './insert-rows';
import { identifiedUnits } from './measurement-import';
import { allRows } from './read-sheets';
import { issuesToProblems, type RowProblem, type RowReader } from './row-reader';
import { invalidUnit, yieldEvery, type CheckedUnit, type ImportHandler } from './run-import';
import { sameNumber, sameText } from './same-values';
import type { HandlerOptions } from './variant-import';

/** One rate point as read. */
interface PointRow {
  reader: RowReader;
  conditions: ConditionValues;
  model: string | null;
  s: number | null;
  v: number | null;
  replicate: number | null;
  excluded: boolean | null;
  exclusionReason: string | null;
}

/** The rows of one assay, or one row that could not be placed in an assay. */
interface AssayGroup {
  rows: PointRow[];
  variant: VariantInfo | null;
  /** Natural key (without the file's assay label), for matching stored assays. */
  key: string | null;
  /** Problems of rows that could not be grouped. */
  problems: RowProblem[];
}

interface AssayPlan {
  variant: VariantInfo;
  input: CreateAssayInput;
  assayColumns: Partial<Assay>;
  fit: AssayFit;
}

interface StoredPoint {
  assay_id: number;
  substrate_molar: number;
  rate_molar_per_second: number;
  replicate: number;
  excluded: number;
  exclusion_reason: string | null;
}

const PREVIEW_COLUMNS = ['Variant', 'Assay date', '[S] (M)', 'v0 (M s⁻¹)', 'Replicate', 'Excluded', 'Fitted kcat (s⁻¹)', 'Fitted Km (M)'];

/**
 * Raw rate points: rows are grouped into assays by variant, conditions, date and the file's assay label;
 * each assay is checked by the schema of POST /api/assays, fitted on import with the chosen model (kcat =
 * Vmax/[E]t) and stored as that route stores one: points in SI, a fitted draft measurement with errors,
 * flags and completeness, audit events. A group that matches a stored assay with rate points (by natural
 * key, same-day assays in order) is unchanged when its points, exclusions, conditions and model agree; raw
 * data are never overwritten, so a group that differs from its stored assay is refused with the reason.
 *
 * @param options manager, lookups, mapping, rows, default campaign, actor
 * @returns the handler
 */
export function ratePointImport(options: HandlerOptions): ImportHandler<AssayGroup, AssayPlan> {
  const { manager, lookups, actorId } = options;
  let storedAssays = new Map<string, StoredAssay[]>();
  const storedPoints = new Map<number, StoredPoint[]>();
  const storedModels = new Map<number, string>();
  const occurrences = new Map<string, number>();
  const touched = new Map<number, Set<number>>();

  return {
    previewColumns: PREVIEW_COLUMNS,

    // An assay's rows may be anywhere in the sheet, so the units are formed once every row is read.
    async *units() {
      const identified = await identifiedUnits(options, await allRows(options.rows));
      const groups = new Map<string, AssayGroup>();
      const ordered: AssayGroup[] = [];
      for (const [index, unit] of identified.entries()) {
        await yieldEvery(index);
        const { reader } = unit;
        const point: PointRow = {
          reader,
          conditions: readConditions(reader),
          model: reader.choice('model'),
          s: reader.required('s', reader.number('s')),
          v: reader.required('v', reader.number('v')),
          replicate: reader.integer('replicate'),
          excluded: reader.boolean('excluded'),
          exclusionReason: reader.text('exclusionReason'),
        };
        const label = reader.text('assayLabel') ?? '';
        const { conditions } = point;
        const problems: RowProblem[] = [];
        if (unit.campaignProblem !== null) problems.push({ row: reader.rowNumber, field: 'campaign', message: unit.campaignProblem });
        else if (unit.variant && !unit.variant.ok) problems.push({ row: reader.rowNumber, field: 'variant', message: unit.variant.message });
        const keyed = conditions.substrate !== null && conditions.temperatureC !== null && conditions.ph !== null && conditions.assayDate !== null;
        if (!unit.variant?.ok || !keyed || problems.length > 0) {
          ordered.push({ rows: [point], variant: null, key: null, problems });
          continue;
        }
        const variant = unit.variant.variant;
        const key = assayKey(variant.id, conditions.substrate!, conditions.temperatureC! + ZERO_CELSIUS_KELVIN, conditions.ph!, conditions.assayDate!);
        const groupKey = `${key}\u0000${label}`;
        const group = groups.get(groupKey);
        if (group) group.rows.push(point);
        else {
          const created: AssayGroup = { rows: [point], variant, key, problems: [] };
          groups.set(groupKey, created);
          ordered.push(created);
        }
      }
      const variantIds = [...new Set(ordered.flatMap((group) => (group.variant ? [group.variant.id] : [])))];
      storedAssays = await loadStoredAssays(manager, variantIds, true);
      // Only the stored assays some group will be compared with are read in full.
      const counts = new Map<string, number>();
      const compared: number[] = [];
      for (const group of ordered) {
        if (group.key === null) continue;
        const occurrence = counts.get(group.key) ?? 0;
        counts.set(group.key, occurrence + 1);
        const stored = storedAssays.get(group.key)?.[occurrence];
        if (stored) compared.push(stored.id);
      }
      for (const point of await queryByIds<StoredPoint>(
        manager,
        compared,
        `SELECT assay_id, substrate_molar, rate_molar_per_second, replicate, excluded, exclusion_reason FROM rate_points WHERE assay_id IN (?) ORDER BY id`,
      )) {
        const list = storedPoints.get(point.assay_id);
        if (list) list.push(point);
        else storedPoints.set(point.assay_id, [point]);
      }
      for (let start = 0; start < compared.length; start += 500) {
        const found = await manager.getRepository(Measurement).find({
          where: { assayId: In(compared.slice(start, start + 500)), supersededById: IsNull() },
          select: { id: true, assayId: true, model: true },
        });
        for (const measurement of found) storedModels.set(measurement.assayId, measurement.model);
      }
      yield ordered;
    },

    rowCount: (group) => group.rows.length,

    check(group) {
      const rowNumbers = group.rows.map((point) => point.reader.rowNumber);
      const problems = [...group.problems, ...group.rows.flatMap((point) => point.reader.problems)];
      const variant = group.variant;
      if (problems.length > 0 || variant === null || group.key === null) return invalidUnit(rowNumbers, problems);
      const [first] = group.rows;

      // One assay has one set of conditions and one model: every row must agree with the first.
      for (const point of group.rows.slice(1)) {
        for (const field of conditionFieldKeys) {
          if (!sameValue(point.conditions[field], first.conditions[field])) {
            problems.push({ row: point.reader.rowNumber, field, message: `differs from row ${first.reader.rowNumber} of the same assay (${show(point.conditions[field])} there ${show(first.conditions[field])})` });
          }
        }
        if (point.model !== first.model) {
          problems.push({ row: point.reader.rowNumber, field: 'model', message: `differs from row ${first.reader.rowNumber} of the same assay` });
        }
      }
      if (problems.length > 0) return invalidUnit(rowNumbers, problems);

      const reader = first.reader;
      const body = {
        variantId: variant.id,
        ...conditionInput(first.conditions, reader),
        points: group.rows.map((point) => ({
          s: point.s,
          v: point.v,
          replicate: point.replicate ?? undefined,
          excluded: point.excluded ?? undefined,
          exclusionReason: point.exclusionReason,
        })),
        sUnit: reader.unit('s'),
        vUnit: reader.unit('v'),
        model: first.model ?? 'michaelis-menten',
      };
      if (body.enzymeConcentration === null) {
        return invalidUnit(rowNumbers, [{ row: reader.rowNumber, field: 'enzymeConcentration', message: 'is required: kcat is Vmax over the enzyme concentration' }]);
      }
      const parsed = createAssayInput.safeParse(body);
      if (!parsed.success) {
        return invalidUnit(
          rowNumbers,
          issuesToProblems(parsed.error.issues, fieldOfPath, reader.rowNumber, (path) => (path[0] === 'points' && typeof path[1] === 'number' ? rowNumbers[path[1]] : undefined)),
        );
      }
      const input = parsed.data;
      let fit: AssayFit;
      try {
        fit = runFit(input.points, input.model, input.sUnit, input.vUnit, input.enzymeConcentration);
      } catch (error) {
        if (!(error instanceof HttpError)) throw error;
        const message = `the assay's points cannot be fitted: ${error.fields?.points ?? error.message}`;
        return invalidUnit(rowNumbers, rowNumbers.map((row) => ({ row, field: null, message })));
      }
      const assayColumns: Partial<Assay> = {
        ...assayConditionColumns(input),
        sUnit: input.sUnit,
        vUnit: input.vUnit,
        replicateCount: new Set(input.points.map((point) => point.replicate)).size,
      };
      const preview = (outcome: ImportPreviewRowDto['outcome']): ImportPreviewRowDto[] =>
        group.rows.map((point, index) => ({
          row: point.reader.rowNumber,
          outcome,
          values: {
            Variant: variant.label,
            'Assay date': input.assayDate,
            '[S] (M)': toMolar(input.points[index].s, input.sUnit),
            'v0 (M s⁻¹)': toMolarPerSecond(input.points[index].v, input.vUnit),
            Replicate: input.points[index].replicate,
            Excluded: input.points[index].excluded,
            'Fitted kcat (s⁻¹)': fit.parameters.kcat.value,
            'Fitted Km (M)': fit.parameters.km.value,
          },
        }));

      const occurrence = occurrences.get(group.key) ?? 0;
      occurrences.set(group.key, occurrence + 1);
      const stored = storedAssays.get(group.key)?.[occurrence];
      if (!stored) return { rows: rowNumbers, outcome: 'new', problems: [], preview: preview('new'), plan: { variant, input, assayColumns, fit }, seen: [] };
      const seen: [string, number][] = [[`assay:${stored.id}`, stored.version]];
      if (sameConditions(assayColumns, stored) && storedModels.get(stored.id) === input.model && samePoints(input, storedPoints.get(stored.id) ?? [])) {
        return { rows: rowNumbers, outcome: 'unchanged', problems: [], preview: preview('unchanged'), plan: null, seen } satisfies CheckedUnit<AssayPlan>;
      }
      const message = `assay ${stored.id} (same variant, conditions and date) already holds other rate points, exclusions or model; an import does not overwrite raw data: refit assay ${stored.id}, or give these rows another assay date or an assay label`;
      return invalidUnit(rowNumbers, rowNumbers.map((row) => ({ row, field: null, message })));
    },

    async write(plans) {
      const now = new Date();
      const assayIds = await insertEntities(
        manager,
        Assay,
        plans.map((plan) => ({ ...plan.assayColumns, variantId: plan.variant.id, operatorId: actorId, createdById: actorId })),
        now,
      );
      const points: Partial<RatePoint>[] = [];
      const measurements: Partial<Measurement>[] = [];
      const events: AuditEntry[] = [];
      plans.forEach((plan, index) => {
        const assayId = assayIds[index];
        for (const point of plan.input.points) {
          points.push({
            assayId,
            substrateMolar: toMolar(point.s, plan.input.sUnit),
            rateMolarPerSecond: toMolarPerSecond(point.v, plan.input.vUnit),
            replicate: point.replicate,
            excluded: point.excluded,
            exclusionReason: point.excluded ? point.exclusionReason : null,
          });
        }
        const assay = { ...plan.assayColumns, id: assayId, variantId: plan.variant.id } as Assay;
        measurements.push(fittedMeasurementColumns(lookups.context(plan.variant), assay, plan.fit, actorId));
        events.push({
          actorId,
          entityType: assayAuditType,
          entityId: assayId,
          campaignId: plan.variant.campaignId,
          action: 'create',
          after: {
            ...assayAuditForm({ id: assayId, variantId: plan.variant.id, substrate: plan.input.substrate, temperatureK: assay.temperatureK, ph: assay.ph }, plan.input.points.length),
            excludedPoints: plan.input.points.filter((point) => point.excluded).length,
          },
        });
      });
      await insertEntities(manager, RatePoint, points, now);
      const measurementIds = await insertEntities(manager, Measurement, measurements, now);
      plans.forEach((plan, index) => {
        const saved = Object.assign(measurements[index], { id: measurementIds[index], version: 1 }) as Measurement;
        events.push({ actorId, entityType: measurementAuditType, entityId: saved.id, campaignId: plan.variant.campaignId, action: 'create', after: measurementSnapshot(saved) });
        const variants = touched.get(plan.variant.campaignId) ?? new Set<number>();
        variants.add(plan.variant.id);
        touched.set(plan.variant.campaignId, variants);
      });
      await insertAuditEvents(manager, events);
    },

    async finish() {
      for (const [campaignId, variantIds] of touched) await recomputeVariantSummaries(manager, campaignId, [...variantIds]);
    },
  };
}

function sameValue(first: string | number | null, second: string | number | null): boolean {
  return typeof first === 'number' || typeof second === 'number' ? sameNumber(first as number | null, second as number | null) : sameText(first, second);
}

function show(value: string | number | null): string {
  return value === null ? 'empty' : String(value);
}

// Points are compared as sets: the order of rows in a sheet is not part of the data.
function samePoints(input: CreateAssayInput, stored: readonly StoredPoint[]): boolean {
  if (input.points.length !== stored.length) return false;
  const order = (a: { replicate: number; s: number; v: number }, b: { replicate: number; s: number; v: number }) => a.replicate - b.replicate || a.s - b.s || a.v - b.v;
  const mine = input.points
    .map((point) => ({
      replicate: point.replicate,
      s: toMolar(point.s, input.sUnit),
      v: toMolarPerSecond(point.v, input.vUnit),
      excluded: point.excluded,
      reason: point.excluded ? point.exclusionReason : null,
    }))
    .sort(order);
  const theirs = stored
    .map((point) => ({ replicate: point.replicate, s: point.substrate_molar, v: point.rate_molar_per_second, excluded: point.excluded === 1, reason: point.exclusion_reason }))
    .sort(order);
  return mine.every(
    (point, index) =>
      point.replicate === theirs[index].replicate &&
      sameNumber(point.s, theirs[index].s) &&
      sameNumber(point.v, theirs[index].v) &&
      point.excluded === theirs[index].excluded &&
      sameText(point.reason, theirs[index].reason),
  );
}

function fieldOfPath(path: readonly PropertyKey[]): string | null {
  const condition = conditionFieldOfPath(path);
  if (condition !== undefined) return condition;
  const [first, , third] = path.map(String);
  if (first === 'variantId') return 'variant';
  if (first === 'points') return ['s', 'v', 'replicate', 'excluded', 'exclusionReason'].includes(third) ? third : 's';
  if (first === 'sUnit') return 's';
  if (first === 'vUnit') return 'v';
  return first === 'model' ? 'model' : null;
}
