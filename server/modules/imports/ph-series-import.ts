import { phRateKindOfUnit } from '@shared/imports/unit-spelling';
import type { ImportPreviewRowDto } from '@shared/schemas/import';
import { createPhProfileInput, phRateSiUnit, phRateToSi, type CreatePhProfileInput, type PhRateKindName } from '@shared/schemas/ph-profile';
import { HttpError } from '../../http/errors';
import { roundCelsius, ZERO_CELSIUS_KELVIN } from '../assays/assay-conditions';
import { recomputeVariantSummaries } from '../comparisons/variant-summary';
import { PhProfile } from '../ph-profiles/ph-profile.entity';
import { phProfileAuditType, phProfileColumns } from '../ph-profiles/ph-profiles.service';
import { queryByIds, type VariantInfo } from './import-lookups';
import { insertAuditEvents, insertEntities } from './insert-rows';
import { identifiedUnits } from './measurement-import';
import { allRows } from './read-sheets';
import { issuesToProblems, type RowProblem, type RowReader } from './row-reader';
import { invalidUnit, yieldEvery, type ImportHandler } from './run-import';
import { keyNumber, sameNumber } from './same-values';
import type { HandlerOptions } from './variant-import';

interface PhRow {
  reader: RowReader;
  ph: number | null;
  rate: number | null;
  excluded: boolean | null;
}

interface PhGroup {
  rows: PhRow[];
  variant: VariantInfo | null;
  key: string | null;
  problems: RowProblem[];
  substrate: string;
  temperatureC: number;
  model: string | null;
}

interface PhPlan {
  variant: VariantInfo;
  columns: Partial<PhProfile>;
}

interface StoredProfile {
  id: number;
  variant_id: number;
  substrate: string;
  temperature_k: number;
  rate_kind: string;
  model: string;
  points: string;
  version: number;
}

const PREVIEW_COLUMNS = ['Variant', 'Substrate', 'Temperature (K)', 'pH', 'Rate', 'Rate unit', 'Excluded', 'Fitted pKa1', 'Fitted pKa2'];

function profileKey(variantId: number, substrate: string, temperatureK: number, rateKind: string, model: string): string {
  return [variantId, substrate.trim().toLowerCase(), keyNumber(temperatureK), rateKind, model].join('\u0000');
}

/**
 * pH series: rows are grouped into one pH–rate profile per variant, substrate, temperature, rate kind,
 * model and the file's series label; the rate's unit says what was measured (1/s kcat, M⁻¹ s⁻¹ kcat/Km,
 * µM/min v0). Each profile is checked by the schema of POST /api/ph-profiles, fitted on import and stored as
 * that route stores one. A series matching a stored profile (same key, in order) is unchanged when its points
 * agree and refused otherwise: stored profiles are not edited.
 *
 * @param options manager, lookups, mapping, rows, default campaign, actor
 * @returns the handler
 */
export function phSeriesImport(options: HandlerOptions): ImportHandler<PhGroup, PhPlan> {
  const { manager, actorId } = options;
  const rateUnit = options.mapping.get('rate')?.unit ?? '';
  const rateKind: PhRateKindName = phRateKindOfUnit(rateUnit);
  let storedProfiles = new Map<string, StoredProfile[]>();
  const occurrences = new Map<string, number>();
  const touched = new Map<number, Set<number>>();

  return {
    previewColumns: PREVIEW_COLUMNS,

    // An assay's rows may be anywhere in the sheet, so the units are formed once every row is read.
    async *units() {
      const identified = await identifiedUnits(options, await allRows(options.rows));
      const groups = new Map<string, PhGroup>();
      const ordered: PhGroup[] = [];
      for (const [index, unit] of identified.entries()) {
        await yieldEvery(index);
        const { reader } = unit;
        const substrate = reader.required('substrate', reader.text('substrate'));
        const temperature = reader.required('temperature', reader.number('temperature'));
        const temperatureC = temperature === null ? null : reader.unit('temperature') === 'K' ? roundCelsius(temperature - ZERO_CELSIUS_KELVIN) : temperature;
        const model = reader.choice('model');
        const label = reader.text('seriesLabel') ?? '';
        const row: PhRow = { reader, ph: reader.required('ph', reader.number('ph')), rate: reader.required('rate', reader.number('rate')), excluded: reader.boolean('excluded') };
        const problems: RowProblem[] = [];
        if (unit.campaignProblem !== null) problems.push({ row: reader.rowNumber, field: 'campaign', message: unit.campaignProblem });
        else if (unit.variant && !unit.variant.ok) problems.push({ row: reader.rowNumber, field: 'variant', message: unit.variant.message });
        if (!unit.variant?.ok || substrate === null || temperatureC === null || problems.length > 0) {
          ordered.push({ rows: [row], variant: null, key: null, problems, substrate: substrate ?? '', temperatureC: temperatureC ?? 0, model });
          continue;
        }
        const variant = unit.variant.variant;
        const key = profileKey(variant.id, substrate, temperatureC + ZERO_CELSIUS_KELVIN, rateKind, model ?? 'bell');
        const groupKey = `${key}\u0000${label}`;
        const group = groups.get(groupKey);
        if (group) group.rows.push(row);
        else {
          const created: PhGroup = { rows: [row], variant, key, problems: [], substrate, temperatureC, model };
          groups.set(groupKey, created);
          ordered.push(created);
        }
      }
      const variantIds = [...new Set(ordered.flatMap((group) => (group.variant ? [group.variant.id] : [])))];
      const stored = await queryByIds<StoredProfile>(
        manager,
        variantIds,
        `SELECT id, variant_id, substrate, temperature_k, rate_kind, model, points, version FROM ph_profiles WHERE variant_id IN (?)`,
      );
      stored.sort((first, second) => first.id - second.id);
      storedProfiles = new Map();
      for (const profile of stored) {
        const key = profileKey(profile.variant_id, profile.substrate, profile.temperature_k, profile.rate_kind, profile.model);
        storedProfiles.set(key, [...(storedProfiles.get(key) ?? []), profile]);
      }
      yield ordered;
    },

    rowCount: (group) => group.rows.length,

    check(group) {
      const rowNumbers = group.rows.map((row) => row.reader.rowNumber);
      const problems = [...group.problems, ...group.rows.flatMap((row) => row.reader.problems)];
      const variant = group.variant;
      if (problems.length > 0 || variant === null || group.key === null) return invalidUnit(rowNumbers, problems);
      const [first] = group.rows;
      if (first.reader.has('rateKind')) {
        for (const row of group.rows) {
          const written = row.reader.choice('rateKind');
          if (written !== null && written !== rateKind) {
            problems.push({ row: row.reader.rowNumber, field: 'rateKind', message: `says ${written} but the rate column is in ${rateUnit}, a ${rateKind} unit` });
          }
        }
        const readProblems = group.rows.flatMap((row) => row.reader.problems);
        if (problems.length > 0 || readProblems.length > 0) return invalidUnit(rowNumbers, [...problems, ...readProblems]);
      }
      const body = {
        variantId: variant.id,
        substrate: group.substrate,
        temperatureC: group.temperatureC,
        rateKind,
        unit: rateUnit,
        model: group.model ?? 'bell',
        points: group.rows.map((row) => ({ ph: row.ph, k: row.rate, excluded: row.excluded ?? undefined })),
      };
      const parsed = createPhProfileInput.safeParse(body);
      if (!parsed.success) {
        return invalidUnit(
          rowNumbers,
          issuesToProblems(parsed.error.issues, fieldOfPath, first.reader.rowNumber, (path) => (path[0] === 'points' && typeof path[1] === 'number' ? rowNumbers[path[1]] : undefined)),
        );
      }
      const input: CreatePhProfileInput = parsed.data;
      let columns: Partial<PhProfile>;
      try {
        columns = phProfileColumns(input, actorId);
      } catch (error) {
        if (!(error instanceof HttpError)) throw error;
        const message = `the series cannot be fitted: ${error.fields?.points ?? error.message}`;
        return invalidUnit(rowNumbers, rowNumbers.map((row) => ({ row, field: null, message })));
      }
      const preview = (outcome: ImportPreviewRowDto['outcome']): ImportPreviewRowDto[] =>
        input.points.map((point, index) => ({
          row: rowNumbers[index],
          outcome,
          values: {
            Variant: variant.label,
            Substrate: input.substrate,
            'Temperature (K)': columns.temperatureK ?? null,
            pH: point.ph,
            Rate: phRateToSi(point.k, input.rateKind, input.unit),
            'Rate unit': phRateSiUnit[input.rateKind],
            Excluded: point.excluded,
            'Fitted pKa1': columns.pka1 ?? null,
            'Fitted pKa2': columns.pka2 ?? null,
          },
        }));
      const occurrence = occurrences.get(group.key) ?? 0;
      occurrences.set(group.key, occurrence + 1);
      const stored = storedProfiles.get(group.key)?.[occurrence];
      if (!stored) return { rows: rowNumbers, outcome: 'new', problems: [], preview: preview('new'), plan: { variant, columns }, seen: [] };
      const seen: [string, number][] = [[`ph-profile:${stored.id}`, stored.version]];
      if (samePoints(columns.points ?? [], JSON.parse(stored.points) as PhProfile['points'])) {
        return { rows: rowNumbers, outcome: 'unchanged', problems: [], preview: preview('unchanged'), plan: null, seen };
      }
      const message = `pH profile ${stored.id} (same variant, substrate, temperature, rate and model) holds other points; stored profiles are not edited by an import: give this series a series label of its own`;
      return invalidUnit(rowNumbers, rowNumbers.map((row) => ({ row, field: null, message })));
    },

    async write(plans) {
      const now = new Date();
      const ids = await insertEntities(manager, PhProfile, plans.map((plan) => plan.columns), now);
      await insertAuditEvents(
        manager,
        plans.map((plan, index) => ({
          actorId,
          entityType: phProfileAuditType,
          entityId: ids[index],
          campaignId: plan.variant.campaignId,
          action: 'create',
          after: {
            id: ids[index],
            variantId: plan.variant.id,
            model: plan.columns.model,
            rateKind: plan.columns.rateKind,
            pka1: plan.columns.pka1,
            pka2: plan.columns.pka2,
            phOptimum: plan.columns.phOptimum,
            points: plan.columns.points?.length ?? 0,
          },
        })),
      );
      for (const plan of plans) {
        const variants = touched.get(plan.variant.campaignId) ?? new Set<number>();
        variants.add(plan.variant.id);
        touched.set(plan.variant.campaignId, variants);
      }
    },

    async finish() {
      for (const [campaignId, variantIds] of touched) await recomputeVariantSummaries(manager, campaignId, [...variantIds]);
    },
  };
}

function samePoints(mine: PhProfile['points'], theirs: PhProfile['points']): boolean {
  if (mine.length !== theirs.length) return false;
  const order = (a: { ph: number; k: number }, b: { ph: number; k: number }) => a.ph - b.ph || a.k - b.k;
  const left = [...mine].sort(order);
  const right = [...theirs].sort(order);
  return left.every((point, index) => sameNumber(point.ph, right[index].ph) && sameNumber(point.k, right[index].k) && Boolean(point.excluded) === Boolean(right[index].excluded));
}

function fieldOfPath(path: readonly PropertyKey[]): string | null {
  const [first, , third] = path.map(String);
  if (first === 'variantId') return 'variant';
  if (first === 'temperatureC') return 'temperature';
  if (first === 'points') return third === 'k' ? 'rate' : third === 'excluded' ? 'excluded' : 'ph';
  if (first === 'unit') return 'rate';
  return ['substrate', 'model', 'rateKind'].includes(first) ? first : null;
}
