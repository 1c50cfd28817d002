import type { EntityManager } from 'typeorm';
import { fromMolar, type ConcentrationUnitInput, type CreateMeasurementInput } from '@shared/schemas/assay';
import { ZERO_CELSIUS_KELVIN, roundCelsius } from '../assays/assay-conditions';
import type { Assay } from '../assays/assay.entity';
import { queryByIds } from './import-lookups';
import type { RowReader } from './row-reader';
import { keyNumber, sameNumber, sameText } from './same-values';

/** The assay conditions a row gives, in the column units (temperature already in °C). */
export interface ConditionValues {
  substrate: string | null;
  temperatureC: number | null;
  ph: number | null;
  bufferName: string | null;
  bufferConcentration: number | null;
  ionicStrength: number | null;
  metalSalt: string | null;
  metalConcentration: number | null;
  otherComponents: string | null;
  method: string | null;
  detection: string | null;
  assayDate: string | null;
  notes: string | null;
  enzymeConcentration: number | null;
}

/** The condition fields compared between the rows of one assay. */
export const conditionFieldKeys = [
  'bufferName',
  'bufferConcentration',
  'ionicStrength',
  'metalSalt',
  'metalConcentration',
  'otherComponents',
  'method',
  'detection',
  'notes',
  'enzymeConcentration',
] as const satisfies readonly (keyof ConditionValues)[];

/**
 * Reads a row's assay conditions, with the problems of required fields left empty and of halves of a pair
 * (a buffer concentration without a buffer, a metal salt without its concentration) on the reader.
 *
 * @param reader the row
 * @returns the conditions as written, temperature in °C
 */
export function readConditions(reader: RowReader): ConditionValues {
  const temperature = reader.required('temperature', reader.number('temperature'));
  const values: ConditionValues = {
    substrate: reader.required('substrate', reader.text('substrate')),
    // The API speaks °C; a kelvin column is converted as the API converts back (°C rounded to 1e-9).
    temperatureC: temperature === null ? null : reader.unit('temperature') === 'K' ? roundCelsius(temperature - ZERO_CELSIUS_KELVIN) : temperature,
    ph: reader.required('ph', reader.number('ph')),
    bufferName: reader.text('bufferName'),
    bufferConcentration: reader.number('bufferConcentration'),
    ionicStrength: reader.number('ionicStrength'),
    metalSalt: reader.text('metalSalt'),
    metalConcentration: reader.number('metalConcentration'),
    otherComponents: reader.text('otherComponents'),
    method: reader.choice('method'),
    detection: reader.text('detection'),
    assayDate: reader.required('assayDate', reader.date('assayDate')),
    notes: reader.text('notes'),
    enzymeConcentration: reader.number('enzymeConcentration'),
  };
  if (values.bufferConcentration !== null && values.bufferName === null) reader.problem('bufferName', 'is required when a buffer concentration is given');
  if (values.metalSalt !== null && values.metalConcentration === null) reader.problem('metalConcentration', 'is required when a metal salt is given');
  if (values.metalConcentration !== null && values.metalSalt === null) reader.problem('metalSalt', 'is required when a metal concentration is given');
  return values;
}

type ConditionInput = Pick<
  CreateMeasurementInput,
  'substrate' | 'temperatureC' | 'ph' | 'buffer' | 'ionicStrength' | 'metal' | 'otherComponents' | 'method' | 'detection' | 'assayDate' | 'notes'
> & { enzymeConcentration: { value: number; unit: ConcentrationUnitInput } | null };

/**
 * The conditions in the shape of the API's bodies (POST /api/measurements and /api/assays), each
 * concentration with its column's unit, so the API's schema and converters apply unchanged.
 *
 * @param values the row's conditions
 * @param reader the row (for the column units)
 * @returns the body fields; unset optional fields are null
 */
export function conditionInput(values: ConditionValues, reader: RowReader): Record<keyof ConditionInput, unknown> {
  return {
    substrate: values.substrate,
    temperatureC: values.temperatureC,
    ph: values.ph,
    buffer: values.bufferName === null ? null : { name: values.bufferName, concentration: concentrationInput(values.bufferConcentration, reader, 'bufferConcentration') },
    ionicStrength: concentrationInput(values.ionicStrength, reader, 'ionicStrength'),
    metal: values.metalSalt === null ? null : { salt: values.metalSalt, concentration: concentrationInput(values.metalConcentration, reader, 'metalConcentration') },
    otherComponents: values.otherComponents,
    method: values.method,
    detection: values.detection,
    assayDate: values.assayDate,
    notes: values.notes,
    enzymeConcentration: concentrationInput(values.enzymeConcentration, reader, 'enzymeConcentration'),
  };
}

// A module function rather than a closure per row: this runs once for every cell of a large sheet.
function concentrationInput(value: number | null, reader: RowReader, key: string): { value: number; unit: string | undefined } | null {
  return value === null ? null : { value, unit: reader.unit(key) };
}

/**
 * The import field of a path in an API body's conditions (`buffer.concentration.value` → bufferConcentration).
 *
 * @param path the path
 * @returns the field, or undefined when the path is not a condition
 */
export function conditionFieldOfPath(path: readonly PropertyKey[]): string | undefined {
  const [first, second] = path.map(String);
  if (first === 'temperatureC') return 'temperature';
  if (first === 'buffer') return second === 'concentration' ? 'bufferConcentration' : 'bufferName';
  if (first === 'metal') return second === 'concentration' ? 'metalConcentration' : 'metalSalt';
  const plain = ['substrate', 'ph', 'ionicStrength', 'otherComponents', 'method', 'detection', 'assayDate', 'notes', 'enzymeConcentration'];
  return plain.includes(first) ? first : undefined;
}

/** An assay as stored, with what an import compares. */
export interface StoredAssay {
  id: number;
  variant_id: number;
  substrate: string;
  temperature_k: number;
  ph: number;
  assay_date: string;
  buffer_name: string | null;
  buffer_molar: number | null;
  ionic_strength_molar: number | null;
  metal_salt: string | null;
  metal_molar: number | null;
  other_components: string | null;
  enzyme_molar: number | null;
  enzyme_unit: string | null;
  method: string | null;
  detection: string | null;
  notes: string | null;
  s_unit: string | null;
  replicate_count: number;
  version: number;
}

/**
 * The natural key of an assay: variant, substrate (any case), temperature, pH and date.
 *
 * @param variantId the variant
 * @param substrate the substrate name
 * @param temperatureK the temperature, K
 * @param ph the pH
 * @param assayDate the day, YYYY-MM-DD
 * @returns the key text
 */
export function assayKey(variantId: number, substrate: string, temperatureK: number, ph: number, assayDate: string): string {
  return [variantId, substrate.trim().toLowerCase(), keyNumber(temperatureK), keyNumber(ph), assayDate].join('\u0000');
}

/**
 * The stored assays of some variants by natural key, each list in the order they were made.
 *
 * @param manager the phase's entity manager
 * @param variantIds the variants
 * @param onlyWithPoints true for assays with rate points only, false for all
 * @returns key → assays
 */
export async function loadStoredAssays(manager: EntityManager, variantIds: readonly number[], onlyWithPoints: boolean): Promise<Map<string, StoredAssay[]>> {
  const records = await queryByIds<StoredAssay>(
    manager,
    variantIds,
    `SELECT id, variant_id, substrate, temperature_k, ph, assay_date, buffer_name, buffer_molar, ionic_strength_molar, metal_salt, metal_molar,
            other_components, enzyme_molar, enzyme_unit, method, detection, notes, s_unit, replicate_count, version
       FROM assays WHERE variant_id IN (?)${onlyWithPoints ? ' AND s_unit IS NOT NULL' : ''}`,
  );
  records.sort((first, second) => first.id - second.id);
  const byKey = new Map<string, StoredAssay[]>();
  for (const record of records) {
    const key = assayKey(record.variant_id, record.substrate, record.temperature_k, record.ph, record.assay_date);
    const list = byKey.get(key);
    if (list) list.push(record);
    else byKey.set(key, [record]);
  }
  return byKey;
}

// A module function rather than a closure per row, as concentrationInput.
function molar(value: number | null): { value: number; unit: 'M' } | null {
  return value === null ? null : { value, unit: 'M' };
}

/**
 * Fills the conditions a sheet does not map from the stored assay, so that an import changes only what it
 * has columns for.
 *
 * @param input the body built from the row
 * @param stored the stored assay it matches
 * @param reader the row (which fields are mapped)
 */
export function keepUnmappedConditions(input: Record<string, unknown>, stored: StoredAssay, reader: RowReader): void {
  if (!reader.has('bufferName') && !reader.has('bufferConcentration')) {
    input.buffer = stored.buffer_name === null ? null : { name: stored.buffer_name, concentration: molar(stored.buffer_molar) };
  }
  if (!reader.has('metalSalt') && !reader.has('metalConcentration')) {
    input.metal = stored.metal_salt === null || stored.metal_molar === null ? null : { salt: stored.metal_salt, concentration: molar(stored.metal_molar) };
  }
  if (!reader.has('ionicStrength')) input.ionicStrength = molar(stored.ionic_strength_molar);
  if (!reader.has('otherComponents')) input.otherComponents = stored.other_components;
  if (!reader.has('method')) input.method = stored.method;
  if (!reader.has('detection')) input.detection = stored.detection;
  if (!reader.has('notes')) input.notes = stored.notes;
  if (!reader.has('enzymeConcentration') && stored.enzyme_molar !== null) {
    const unit = (stored.enzyme_unit ?? 'M') as ConcentrationUnitInput;
    input.enzymeConcentration = { value: fromMolar(stored.enzyme_molar, unit), unit };
  }
}

/**
 * Whether the assay columns an import would write equal the stored ones.
 *
 * @param columns the new columns (from assayConditionColumns)
 * @param stored the stored assay
 * @returns true when nothing would change
 */
export function sameConditions(columns: Partial<Assay>, stored: StoredAssay): boolean {
  return (
    sameText(columns.substrate, stored.substrate) &&
    sameText(columns.bufferName, stored.buffer_name) &&
    sameNumber(columns.bufferMolar, stored.buffer_molar) &&
    sameNumber(columns.ionicStrengthMolar, stored.ionic_strength_molar) &&
    sameText(columns.metalSalt, stored.metal_salt) &&
    sameNumber(columns.metalMolar, stored.metal_molar) &&
    sameText(columns.otherComponents, stored.other_components) &&
    sameNumber(columns.enzymeMolar, stored.enzyme_molar) &&
    sameText(columns.method, stored.method) &&
    sameText(columns.detection, stored.detection) &&
    sameText(columns.notes, stored.notes)
  );
}

/** The audited form of an assay's conditions, as the assays module writes it. */
export function assayAuditForm(assay: { id: number; variantId: number; substrate: string; temperatureK: number; ph: number }, points: number) {
  return { id: assay.id, variantId: assay.variantId, substrate: assay.substrate, temperatureK: assay.temperatureK, ph: assay.ph, points };
}
