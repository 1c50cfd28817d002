import { In, IsNull } from 'typeorm';
import { createMeasurementInput, toMolar, toPerMolarPerSecond, toPerSecond, type CreateMeasurementInput } from '@shared/schemas/assay';
import type { ImportPreviewRowDto } from '@shared/schemas/import';
import { sqliteFromDate } from '../../sqlite-datetime';
import { assayConditionColumns, ZERO_CELSIUS_KELVIN } from '../assays/assay-conditions';
import { Assay } from '../assays/assay.entity';
import type { AuditEntry } from '../audit/record-audit';
import { recomputeVariantSummaries } from '../comparisons/variant-summary';
import { measurementAuditType, measurementSnapshot } from '../measurements/measurement-dto';
import { Measurement } from '../measurements/measurement.entity';
import { assayAuditType, enteredMeasurementColumns } from '../measurements/measurements.service';
import {
  assayAuditForm,
  assayKey,
  conditionFieldOfPath,
  conditionInput,
  keepUnmappedConditions,
  loadStoredAssays,
  readConditions,
  sameConditions,
  type StoredAssay,
} from './assay-rows';
import type { VariantInfo, VariantLookup } from './import-lookups';
import { insertAuditEvents, insertEntities } from './insert-rows';
import { certainMeasurementInput } from './measurement-input';
import { issuesToProblems, RowReader } from './row-reader';
import { invalidUnit, yieldEvery, type ImportHandler } from './run-import';
import { sameNumber, sameText } from './same-values';
import type { SheetRow } from './read-sheets';
import type { HandlerOptions } from './variant-import';

/** A row with the campaign and variant it names. */
export interface MeasurementUnit {
  reader: RowReader;
  campaignText: string | null;
  variantText: string | null;
  campaignProblem: string | null;
  variant: VariantLookup | null;
}

interface MeasurementPlan {
  variant: VariantInfo;
  assayColumns: Partial<Assay>;
  input: CreateMeasurementInput;
  /** The measurement's columns, all but its assay id. */
  columns: Partial<Measurement>;
  stored: { assay: StoredAssay; measurement: Measurement | null } | null;
}

const PREVIEW_COLUMNS = [
  'Campaign',
  'Variant',
  'Substrate',
  'Temperature (K)',
  'pH',
  'Assay date',
  'Model',
  'kcat (s⁻¹)',
  'kcat SE (s⁻¹)',
  'Km (M)',
  'Km SE (M)',
  'kcat/Km (M⁻¹ s⁻¹)',
];

// The stored measurement fields an entered measurement is compared on.
const COMPARED_NUMBERS: readonly (keyof Measurement)[] = ['kcat', 'kcatSe', 'km', 'kmSe', 'kcatOverKm', 'kcatOverKmSe', 'ki', 'kiSe', 'hillN', 'hillNSe', 'substrateMinMolar', 'substrateMaxMolar'];

/**
 * Measurements with fitted values: one row a measurement entered as reported values, checked by the schema
 * of POST /api/measurements and stored as it stores one (SI units, kcat/Km derived when not given,
 * plausibility flags, STRENDA completeness, a draft). A row matches a stored assay without rate points by
 * its natural key (variant, substrate, temperature, pH, date; several same-day replicates in order); when
 * conditions or values differ, the assay is updated (version raised) and its measurement superseded by the
 * new one, never deleted, with audit events as the API writes them. An assay holding rate points is not
 * overwritten: its values come from a fit.
 *
 * @param options manager, lookups, mapping, rows, default campaign, actor
 * @returns the handler
 */
export function measurementImport(options: HandlerOptions): ImportHandler<MeasurementUnit, MeasurementPlan> {
  const { manager, lookups, actorId } = options;
  const storedAssays = new Map<string, StoredAssay[]>();
  const loadedVariants = new Set<number>();
  const currentMeasurements = new Map<number, Measurement>();
  const occurrences = new Map<string, number>();
  const touched = new Map<number, Set<number>>();

  return {
    previewColumns: PREVIEW_COLUMNS,

    // Rows stand alone, so each batch is checked and written as it arrives. A variant's stored assays are read
    // with the first batch that names it: earlier batches wrote only for the variants they named, so what is
    // read is still the state before the import.
    async *units() {
      for await (const rows of options.rows) {
        const units = await identifiedUnits(options, rows);
        const variantIds = [...new Set(units.flatMap((unit) => (unit.variant?.ok ? [unit.variant.variant.id] : [])))].filter((id) => !loadedVariants.has(id));
        for (const id of variantIds) loadedVariants.add(id);
        const found = await loadStoredAssays(manager, variantIds, false);
        for (const [key, assays] of found) storedAssays.set(key, assays);
        const assayIds = [...found.values()].flat().map((assay) => assay.id);
        for (let start = 0; start < assayIds.length; start += 500) {
          const current = await manager.getRepository(Measurement).find({ where: { assayId: In(assayIds.slice(start, start + 500)), supersededById: IsNull() } });
          for (const measurement of current) currentMeasurements.set(measurement.assayId, measurement);
        }
        yield units;
      }
    },

    rowCount: () => 1,

    check(unit, withPreview) {
      const { reader } = unit;
      const row = reader.rowNumber;
      if (unit.campaignProblem !== null) reader.problem('campaign', unit.campaignProblem);
      else if (unit.variant && !unit.variant.ok) reader.problem('variant', unit.variant.message);
      const conditions = readConditions(reader);
      const model = reader.choice('model');
      const kcat = reader.required('kcat', reader.number('kcat'));
      const kcatSe = reader.required('kcatSe', reader.number('kcatSe'));
      const km = reader.required('km', reader.number('km'));
      const kmSe = reader.required('kmSe', reader.number('kmSe'));
      const kcatOverKm = reader.number('kcatOverKm');
      const kcatOverKmSe = reader.number('kcatOverKmSe');
      const ki = reader.number('ki');
      const kiSe = reader.number('kiSe');
      const hill = reader.number('hill');
      const hillSe = reader.number('hillSe');
      const substrateMin = reader.number('substrateMin');
      const substrateMax = reader.number('substrateMax');
      const replicateCount = reader.integer('replicateCount');
      const fittingMethod = reader.text('fittingMethod');
      pairProblem(reader, 'kcatOverKm', kcatOverKm, 'kcatOverKmSe', kcatOverKmSe);
      pairProblem(reader, 'ki', ki, 'kiSe', kiSe);
      pairProblem(reader, 'hill', hill, 'hillSe', hillSe);
      pairProblem(reader, 'substrateMin', substrateMin, 'substrateMax', substrateMax);
      if (reader.problems.length > 0 || !unit.variant?.ok) return invalidUnit([row], reader.problems);
      const variant = unit.variant.variant;

      const body: Record<string, unknown> = {
        variantId: variant.id,
        ...conditionInput(conditions, reader),
        model: model ?? undefined,
        kcat: { value: kcat, se: kcatSe, unit: reader.unit('kcat') },
        km: { value: km, se: kmSe, unit: reader.unit('km') },
        kcatOverKm: kcatOverKm === null ? null : { value: kcatOverKm, se: kcatOverKmSe, unit: reader.unit('kcatOverKm') },
        ki: ki === null ? null : { value: ki, se: kiSe, unit: reader.unit('ki') },
        hill: hill === null ? null : { value: hill, se: hillSe },
        substrateRange: substrateMin === null ? null : { min: substrateMin, max: substrateMax, unit: reader.unit('substrateMin') ?? reader.unit('substrateMax') },
        replicateCount,
        fittingMethod,
      };
      const key = assayKey(variant.id, conditions.substrate!, conditions.temperatureC! + ZERO_CELSIUS_KELVIN, conditions.ph!, conditions.assayDate!);
      const occurrence = occurrences.get(key) ?? 0;
      occurrences.set(key, occurrence + 1);
      const storedAssay = storedAssays.get(key)?.[occurrence] ?? null;
      if (storedAssay) keepUnmappedConditions(body, storedAssay, reader);

      let parsed = certainMeasurementInput(body);
      if (parsed === null) {
        const checked = createMeasurementInput.safeParse(body);
        if (!checked.success) return invalidUnit([row], issuesToProblems(checked.error.issues, fieldOfPath, row));
        parsed = checked.data;
      }
      const input = withoutDerivedSpecificity(parsed);
      const assayColumns = assayConditionColumns(input);
      assayColumns.replicateCount = input.replicateCount ?? 1;
      // Built once here and written as is: the same columns POST /api/measurements would store.
      // The assay id is set when the assay is written.
      const columns = enteredMeasurementColumns(lookups.context(variant), assayColumns as Assay, input, actorId);
      const plan: MeasurementPlan = { variant, assayColumns, input, columns, stored: null };
      const campaignName = withPreview ? (lookups.campaignById(variant.campaignId)?.campaign.name ?? null) : null;

      if (storedAssay === null) return { rows: [row], outcome: 'new', problems: [], preview: previewRows(withPreview, row, 'new', plan, campaignName), plan, seen: [] };
      const current = currentMeasurements.get(storedAssay.id) ?? null;
      const seen: [string, number][] = [[`assay:${storedAssay.id}`, storedAssay.version]];
      if (current) seen.push([`measurement:${current.id}`, current.version]);
      if (current !== null && sameMeasurement(assayColumns, columns, storedAssay, current)) {
        return { rows: [row], outcome: 'unchanged', problems: [], preview: previewRows(withPreview, row, 'unchanged', plan, campaignName), plan: null, seen };
      }
      // An assay with rate points takes no entered values: they come from its fit.
      if (storedAssay.s_unit !== null) {
        const message = `assay ${storedAssay.id} of ${variant.label} on ${input.assayDate} under these conditions holds rate points and its values come from a fit; refit it instead`;
        return invalidUnit([row], [{ row, field: null, message }]);
      }
      plan.stored = { assay: storedAssay, measurement: current };
      return { rows: [row], outcome: 'updated', problems: [], preview: previewRows(withPreview, row, 'updated', plan, campaignName), plan, seen };
    },

    async write(plans) {
      const now = new Date();
      const created = plans.filter((plan) => plan.stored === null);
      const assayIds = await insertEntities(
        manager,
        Assay,
        created.map((plan) => Object.assign(plan.assayColumns, { variantId: plan.variant.id, operatorId: actorId, sUnit: null, vUnit: null, createdById: actorId })),
        now,
      );
      const events: AuditEntry[] = [];
      const measurementRows: Partial<Measurement>[] = [];
      const owners: { plan: MeasurementPlan; assayId: number }[] = [];
      created.forEach((plan, index) => {
        const assay = plan.assayColumns as Assay;
        measurementRows.push(Object.assign(plan.columns, { assayId: assayIds[index] }));
        owners.push({ plan, assayId: assayIds[index] });
        events.push({
          actorId,
          entityType: assayAuditType,
          entityId: assayIds[index],
          campaignId: plan.variant.campaignId,
          action: 'create',
          after: assayAuditForm({ id: assayIds[index], variantId: plan.variant.id, substrate: plan.input.substrate, temperatureK: assay.temperatureK, ph: assay.ph }, 0),
        });
      });
      for (const plan of plans) {
        if (plan.stored === null) continue;
        const { assay } = plan.stored;
        const columns = plan.assayColumns;
        const updated: unknown[] = await manager.query(
          `UPDATE assays SET buffer_name = ?, buffer_molar = ?, ionic_strength_molar = ?, metal_salt = ?, metal_molar = ?, other_components = ?,
                  enzyme_molar = ?, enzyme_unit = ?, method = ?, detection = ?, notes = ?, replicate_count = ?, version = version + 1, updated_at = ?
            WHERE id = ? AND version = ? RETURNING id`,
          [
            columns.bufferName ?? null,
            columns.bufferMolar ?? null,
            columns.ionicStrengthMolar ?? null,
            columns.metalSalt ?? null,
            columns.metalMolar ?? null,
            columns.otherComponents ?? null,
            columns.enzymeMolar ?? null,
            columns.enzymeUnit ?? null,
            columns.method ?? null,
            columns.detection ?? null,
            columns.notes ?? null,
            columns.replicateCount ?? 1,
            sqliteFromDate(now),
            assay.id,
            assay.version,
          ],
        );
        if (updated.length === 0) throw new Error(`assay ${assay.id} changed while the import was writing`);
        measurementRows.push(Object.assign(plan.columns, { assayId: assay.id }));
        owners.push({ plan, assayId: assay.id });
        events.push({
          actorId,
          entityType: assayAuditType,
          entityId: assay.id,
          campaignId: plan.variant.campaignId,
          action: 'update',
          before: storedConditionsForm(assay),
          after: storedConditionsForm({ ...assay, ...toStoredForm(columns) }),
        });
      }
      const measurementIds = await insertEntities(manager, Measurement, measurementRows, now);
      for (const [index, { plan }] of owners.entries()) {
        // The row just inserted, now with its id, is the new measurement as stored.
        const saved = Object.assign(measurementRows[index], { id: measurementIds[index], version: 1 }) as Measurement;
        events.push({ actorId, entityType: measurementAuditType, entityId: saved.id, campaignId: plan.variant.campaignId, action: 'create', after: measurementSnapshot(saved) });
        const old = plan.stored?.measurement ?? null;
        if (old !== null) {
          const superseded: unknown[] = await manager.query(
            `UPDATE measurements SET superseded_by_id = ?, version = version + 1, updated_at = ? WHERE id = ? AND version = ? RETURNING id`,
            [saved.id, sqliteFromDate(now), old.id, old.version],
          );
          if (superseded.length === 0) throw new Error(`measurement ${old.id} changed while the import was writing`);
          const after = Object.assign(new Measurement(), old, { supersededById: saved.id, version: old.version + 1 });
          events.push({
            actorId,
            entityType: measurementAuditType,
            entityId: old.id,
            campaignId: plan.variant.campaignId,
            action: 'supersede',
            before: measurementSnapshot(old),
            after: measurementSnapshot(after),
          });
        }
        const variants = touched.get(plan.variant.campaignId) ?? new Set<number>();
        variants.add(plan.variant.id);
        touched.set(plan.variant.campaignId, variants);
      }
      await insertAuditEvents(manager, events);
    },

    async finish() {
      for (const [campaignId, variantIds] of touched) await recomputeVariantSummaries(manager, campaignId, [...variantIds]);
    },
  };
}

/**
 * Rows of a kind that names a campaign and a variant, each with the registered variant found for it (the
 * campaigns' variants are loaded first).
 *
 * @param options the handler options
 * @param rows the rows (a batch, or the whole sheet)
 * @returns one unit a row, in row order
 */
export async function identifiedUnits(options: HandlerOptions, rows: readonly SheetRow[]): Promise<MeasurementUnit[]> {
  const { lookups, mapping } = options;
  const units: MeasurementUnit[] = [];
  const campaignIds = new Set<number>();
  for (const [index, row] of rows.entries()) {
    await yieldEvery(index);
    const reader = new RowReader(mapping, row);
    const campaignText = reader.text('campaign');
    const variantText = reader.text('variant');
    const campaign = lookups.campaign(campaignText, options.defaultCampaignId);
    units.push({ reader, campaignText, variantText, campaignProblem: campaign.ok ? null : campaign.message, variant: null });
    if (campaign.ok) campaignIds.add(campaign.info.campaign.id);
  }
  await lookups.loadVariants(campaignIds);
  for (const [index, unit] of units.entries()) {
    await yieldEvery(index);
    const campaign = lookups.campaign(unit.campaignText, options.defaultCampaignId);
    if (campaign.ok) unit.variant = lookups.variant(campaign.info, unit.variantText);
  }
  return units;
}

function previewRows(wanted: boolean, row: number, outcome: ImportPreviewRowDto['outcome'], plan: MeasurementPlan, campaignName: string | null): ImportPreviewRowDto[] {
  if (!wanted) return [];
  const { input, columns } = plan;
  return [{
    row,
    outcome,
    values: {
      Campaign: campaignName,
      Variant: plan.variant.label,
      Substrate: input.substrate,
      'Temperature (K)': plan.assayColumns.temperatureK ?? null,
      pH: input.ph,
      'Assay date': input.assayDate,
      Model: input.model,
      'kcat (s⁻¹)': columns.kcat ?? null,
      'kcat SE (s⁻¹)': columns.kcatSe ?? null,
      'Km (M)': columns.km ?? null,
      'Km SE (M)': columns.kmSe ?? null,
      'kcat/Km (M⁻¹ s⁻¹)': columns.kcatOverKm ?? null,
    },
  }];
}

function sameMeasurement(assayColumns: Partial<Assay>, columns: Partial<Measurement>, stored: StoredAssay, current: Measurement): boolean {
  if (!sameConditions(assayColumns, stored) || (assayColumns.replicateCount ?? 1) !== stored.replicate_count) return false;
  if (current.model !== columns.model || !sameText(current.fittingMethod, columns.fittingMethod)) return false;
  return COMPARED_NUMBERS.every((field) => sameNumber(current[field] as number | null, columns[field] as number | null));
}

function pairProblem(reader: RowReader, valueKey: string, value: number | null, otherKey: string, other: number | null): void {
  if ((value === null) === (other === null)) return;
  const [missing, given] = value === null ? [valueKey, otherKey] : [otherKey, valueKey];
  if (reader.problems.some((problem) => problem.field === missing)) return;
  reader.problem(missing, `is required with ${reader.mapping.get(given)?.field.label ?? given}`);
}

function fieldOfPath(path: readonly PropertyKey[]): string | null {
  const condition = conditionFieldOfPath(path);
  if (condition !== undefined) return condition;
  const [first, second] = path.map(String);
  if (first === 'variantId') return 'variant';
  if (first === 'substrateRange') return second === 'max' ? 'substrateMax' : 'substrateMin';
  if (['kcat', 'km', 'kcatOverKm', 'ki', 'hill'].includes(first)) return second === 'se' ? `${first}Se` : first;
  return ['model', 'replicateCount', 'fittingMethod'].includes(first) ? first : null;
}

/**
 * A kcat/Km that is exactly kcat/Km with the independent-error SE is the derived value (an export writes it
 * out); it is left to be derived again, with the API's warning, so that a re-import stores the same record.
 */
function withoutDerivedSpecificity(input: CreateMeasurementInput): CreateMeasurementInput {
  if (!input.kcatOverKm || input.model === 'hill') return input;
  // The same derivation as enteredMeasurementColumns: kcat/Km with the relative errors of kcat and Km combined.
  const kcatPerSecond = toPerSecond(input.kcat.value, input.kcat.unit);
  const kmMolar = toMolar(input.km.value, input.km.unit);
  const derived = kcatPerSecond / kmMolar;
  const derivedSe = derived * Math.hypot(toPerSecond(input.kcat.se, input.kcat.unit) / kcatPerSecond, toMolar(input.km.se, input.km.unit) / kmMolar);
  const given = toPerMolarPerSecond(input.kcatOverKm.value, input.kcatOverKm.unit);
  const givenSe = toPerMolarPerSecond(input.kcatOverKm.se, input.kcatOverKm.unit);
  return sameNumber(derived, given) && sameNumber(derivedSe, givenSe) ? { ...input, kcatOverKm: null } : input;
}

function toStoredForm(columns: Partial<Assay>): Partial<StoredAssay> {
  return {
    buffer_name: columns.bufferName ?? null,
    buffer_molar: columns.bufferMolar ?? null,
    ionic_strength_molar: columns.ionicStrengthMolar ?? null,
    metal_salt: columns.metalSalt ?? null,
    metal_molar: columns.metalMolar ?? null,
    other_components: columns.otherComponents ?? null,
    enzyme_molar: columns.enzymeMolar ?? null,
    method: columns.method ?? null,
    detection: columns.detection ?? null,
    notes: columns.notes ?? null,
    replicate_count: columns.replicateCount ?? 1,
  };
}

function storedConditionsForm(assay: StoredAssay) {
  return {
    id: assay.id,
    variantId: assay.variant_id,
    bufferName: assay.buffer_name,
    bufferMolar: assay.buffer_molar,
    ionicStrengthMolar: assay.ionic_strength_molar,
    metalSalt: assay.metal_salt,
    metalMolar: assay.metal_molar,
    otherComponents: assay.other_components,
    enzymeMolar: assay.enzyme_molar,
    method: assay.method,
    detection: assay.detection,
    notes: assay.notes,
    replicateCount: assay.replicate_count,
    version: assay.version,
  };
}
