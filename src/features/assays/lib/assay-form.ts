import {
  concentrationUnits,
  createAssayInput,
  kineticModels,
  rateUnits,
  type ConcentrationUnitInput,
  type CreateAssayInput,
  type KineticModelName,
  type RateUnitInput,
} from '@shared/schemas/assay';

/** The conditions form as typed (every input is text until it is sent). */
export interface AssayConditionsValues {
  variantId: string;
  substrate: string;
  temperatureC: string;
  ph: string;
  bufferName: string;
  bufferMm: string;
  ionicStrengthMm: string;
  metalSalt: string;
  metalValue: string;
  metalUnit: ConcentrationUnitInput;
  otherComponents: string;
  enzymeValue: string;
  enzymeUnit: ConcentrationUnitInput;
  method: '' | 'continuous' | 'discontinuous';
  detection: string;
  assayDate: string;
  notes: string;
  sUnit: ConcentrationUnitInput;
  vUnit: RateUnitInput;
  model: KineticModelName;
}

/** The units offered in the pickers: one spelling each (the API also takes uM and the Greek mu). */
export const concentrationUnitChoices: readonly ConcentrationUnitInput[] = concentrationUnits.filter((unit) => unit !== 'uM' && unit !== 'μM');
export const rateUnitChoices: readonly RateUnitInput[] = rateUnits.filter((unit) => !unit.startsWith('uM') && !unit.startsWith('μM'));

/** Today in the browser's time zone, ISO `YYYY-MM-DD`. */
export function today(): string {
  const now = new Date();
  return new Date(now.getTime() - now.getTimezoneOffset() * 60_000).toISOString().slice(0, 10);
}

/** Empty conditions with the units most plate-reader assays use. */
export function blankConditions(): AssayConditionsValues {
  return {
    variantId: '',
    substrate: '',
    temperatureC: '',
    ph: '',
    bufferName: '',
    bufferMm: '',
    ionicStrengthMm: '',
    metalSalt: '',
    metalValue: '',
    metalUnit: 'µM',
    otherComponents: '',
    enzymeValue: '',
    enzymeUnit: 'nM',
    method: 'continuous',
    detection: '',
    assayDate: today(),
    notes: '',
    sUnit: 'mM',
    vUnit: 'µM/min',
    model: 'michaelis-menten',
  };
}

/** The fields remembered between assays: the conditions of a series, not what identifies one assay. */
export const rememberedFields = [
  'substrate',
  'temperatureC',
  'ph',
  'bufferName',
  'bufferMm',
  'ionicStrengthMm',
  'metalSalt',
  'metalValue',
  'metalUnit',
  'otherComponents',
  'enzymeValue',
  'enzymeUnit',
  'method',
  'detection',
  'sUnit',
  'vUnit',
  'model',
] as const satisfies readonly (keyof AssayConditionsValues)[];

const CHOICES: Partial<Record<keyof AssayConditionsValues, readonly string[]>> = {
  metalUnit: concentrationUnitChoices,
  enzymeUnit: concentrationUnitChoices,
  sUnit: concentrationUnitChoices,
  vUnit: rateUnitChoices,
  model: kineticModels,
  method: ['', 'continuous', 'discontinuous'],
};

/**
 * Keeps only remembered fields with a text value (and a listed choice where there is a list), so that
 * stored data from an older version or another tool cannot put a wrong value into the form.
 */
export function cleanRemembered(stored: unknown): Partial<AssayConditionsValues> {
  if (!stored || typeof stored !== 'object') return {};
  const entries = rememberedFields
    .map((field) => [field, (stored as Record<string, unknown>)[field]] as const)
    .filter((entry): entry is readonly [(typeof rememberedFields)[number], string] => typeof entry[1] === 'string')
    .filter(([field, value]) => CHOICES[field] === undefined || CHOICES[field]!.includes(value));
  return Object.fromEntries(entries) as Partial<AssayConditionsValues>;
}

const text = (value: string) => (value.trim() === '' ? undefined : value.trim());
// Empty stays undefined (the schema then says the field is required); anything else goes as a number,
// NaN included, so the schema's own message names the field.
const number = (value: string) => (value.trim() === '' ? undefined : Number(value.trim().replace(',', '.')));

/** The body of POST /api/assays as built from the form and the grid, not yet checked: {@link checkAssayBody} does that. */
export function assayBody(values: AssayConditionsValues, points: CreateAssayInput['points']): Record<string, unknown> {
  const bufferMm = number(values.bufferMm);
  const metalValue = number(values.metalValue);
  const ionicStrengthMm = number(values.ionicStrengthMm);
  return {
    variantId: values.variantId === '' ? undefined : Number(values.variantId),
    substrate: values.substrate,
    temperatureC: number(values.temperatureC),
    ph: number(values.ph),
    buffer:
      text(values.bufferName) || bufferMm !== undefined
        ? { name: values.bufferName, concentration: bufferMm === undefined ? null : { value: bufferMm, unit: 'mM' } }
        : null,
    ionicStrength: ionicStrengthMm === undefined ? null : { value: ionicStrengthMm, unit: 'mM' },
    metal: text(values.metalSalt) || metalValue !== undefined ? { salt: values.metalSalt, concentration: { value: metalValue, unit: values.metalUnit } } : null,
    otherComponents: text(values.otherComponents) ?? null,
    enzymeConcentration: { value: number(values.enzymeValue), unit: values.enzymeUnit },
    method: values.method === '' ? null : values.method,
    detection: text(values.detection) ?? null,
    assayDate: values.assayDate,
    notes: text(values.notes) ?? null,
    points,
    sUnit: values.sUnit,
    vUnit: values.vUnit,
    model: values.model,
  };
}

/** Form fields by the schema path of their value, for putting schema and server messages on the field. */
const FIELD_BY_PATH: Record<string, keyof AssayConditionsValues> = {
  variantId: 'variantId',
  substrate: 'substrate',
  temperatureC: 'temperatureC',
  ph: 'ph',
  'buffer.name': 'bufferName',
  'buffer.concentration.value': 'bufferMm',
  'ionicStrength.value': 'ionicStrengthMm',
  'metal.salt': 'metalSalt',
  'metal.concentration.value': 'metalValue',
  'metal.concentration.unit': 'metalUnit',
  otherComponents: 'otherComponents',
  'enzymeConcentration.value': 'enzymeValue',
  'enzymeConcentration.unit': 'enzymeUnit',
  method: 'method',
  detection: 'detection',
  assayDate: 'assayDate',
  notes: 'notes',
  sUnit: 'sUnit',
  vUnit: 'vUnit',
  model: 'model',
};

/**
 * Splits field messages (from the shared schema or the server, keyed by dotted path) into messages for
 * form fields and messages about the points.
 *
 * @param fields path → message
 * @param values the form as typed, so that an empty required field reads "is required"
 * @returns messages per form field, and the rest (points and anything unknown) as sentences
 */
export function sortFieldMessages(
  fields: Record<string, string>,
  values: AssayConditionsValues,
): { byField: Partial<Record<keyof AssayConditionsValues, string>>; other: string[] } {
  const byField: Partial<Record<keyof AssayConditionsValues, string>> = {};
  const other: string[] = [];
  for (const [path, message] of Object.entries(fields)) {
    const field = FIELD_BY_PATH[path];
    if (field === undefined) {
      other.push(path.startsWith('points') ? `Rate points: ${message}.` : `${path}: ${message}.`);
      continue;
    }
    byField[field] ??= String(values[field]).trim() === '' ? 'is required' : message;
  }
  return { byField, other };
}

/**
 * Checks the body with the shared schema, as the server will, and returns the messages by path.
 *
 * @param body the body from {@link assayBody}
 * @returns the parsed input, or the messages
 */
export function checkAssayBody(body: unknown): { ok: true; input: CreateAssayInput } | { ok: false; fields: Record<string, string> } {
  const result = createAssayInput.safeParse(body);
  if (result.success) return { ok: true, input: result.data };
  const fields: Record<string, string> = {};
  for (const issue of result.error.issues) fields[issue.path.join('.') || '_'] ??= issue.message;
  return { ok: false, fields };
}
