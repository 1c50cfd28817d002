import {
  assayMethods,
  concentrationUnits,
  kineticModels,
  specificityUnits,
  temperatureRangeCelsius,
  turnoverUnits,
  type ConcentrationUnitInput,
  type CreateMeasurementInput,
  type SpecificityUnitInput,
  type TurnoverUnitInput,
} from '@shared/schemas/assay';
import { withinMagnitude } from '@shared/schemas/finite-number';

// The schema's lists, as sets for the per-row checks.
const CONCENTRATION_UNITS: ReadonlySet<unknown> = new Set(concentrationUnits);
const TURNOVER_UNITS: ReadonlySet<unknown> = new Set(turnoverUnits);
const SPECIFICITY_UNITS: ReadonlySet<unknown> = new Set(specificityUnits);
const MODELS: ReadonlySet<unknown> = new Set(kineticModels);
const METHODS: ReadonlySet<unknown> = new Set(assayMethods);
const ISO_DAY = /^\d{4}-\d{2}-\d{2}$/;
const MAX_REPLICATES = 1000;

/** A field that is not valid beyond doubt: the schema then has the last word. */
class NotCertain extends Error {}
// One instance, thrown by every check: a row the schema has to look at costs no new error.
const notCertain = new NotCertain();

type Body = Readonly<Record<string, unknown>>;

// An optional field is null or a value; undefined (a key the import did not set) is left to the schema.
function given(value: unknown): boolean {
  if (value === undefined) throw notCertain;
  return value !== null;
}

function objectAt(value: unknown): Body {
  if (typeof value !== 'object' || value === null || Array.isArray(value)) throw notCertain;
  return value as Body;
}

function numberFrom(value: unknown, lowest: number, inclusive: boolean, highest = Infinity): number {
  if (typeof value !== 'number' || !Number.isFinite(value) || !withinMagnitude(value) || (inclusive ? value < lowest : value <= lowest) || value > highest) {
    throw notCertain;
  }
  return value;
}

function wholeNumber(value: unknown, highest: number): number {
  if (typeof value !== 'number' || !Number.isSafeInteger(value) || value < 1 || value > highest) throw notCertain;
  return value;
}

// The schema trims text before it checks the length; optional text left empty becomes null.
function text(value: unknown, maximum: number, required: boolean): string | null {
  if (typeof value !== 'string') throw notCertain;
  const trimmed = value.trim();
  if (trimmed.length > maximum || (required && trimmed.length === 0)) throw notCertain;
  return trimmed === '' ? null : trimmed;
}

function member<T>(value: unknown, members: ReadonlySet<unknown>): T {
  if (!members.has(value)) throw notCertain;
  return value as T;
}

function concentration(value: unknown, zeroAllowed: boolean): { value: number; unit: ConcentrationUnitInput } {
  const object = objectAt(value);
  return { value: numberFrom(object.value, 0, zeroAllowed), unit: member(object.unit, CONCENTRATION_UNITS) };
}

function parameter<U>(value: unknown, units: ReadonlySet<unknown>): { value: number; se: number; unit: U } {
  const object = objectAt(value);
  return { value: numberFrom(object.value, 0, false), se: numberFrom(object.se, 0, false), unit: member<U>(object.unit, units) };
}

function buffer(value: unknown): NonNullable<CreateMeasurementInput['buffer']> {
  const object = objectAt(value);
  return { name: text(object.name, 100, true)!, concentration: given(object.concentration) ? concentration(object.concentration, false) : null };
}

function metal(value: unknown): NonNullable<CreateMeasurementInput['metal']> {
  const object = objectAt(value);
  return { salt: text(object.salt, 50, true)!, concentration: concentration(object.concentration, false) };
}

function hill(value: unknown): NonNullable<CreateMeasurementInput['hill']> {
  const object = objectAt(value);
  return { value: numberFrom(object.value, 0, false), se: numberFrom(object.se, 0, false) };
}

function substrateRange(value: unknown): NonNullable<CreateMeasurementInput['substrateRange']> {
  const object = objectAt(value);
  const range = { min: numberFrom(object.min, 0, true), max: numberFrom(object.max, 0, false), unit: member<ConcentrationUnitInput>(object.unit, CONCENTRATION_UNITS) };
  if (range.max <= range.min) throw notCertain;
  return range;
}

// Days already found to exist: a sheet names a few dates many times, and reading one back through Date is
// the dearest check of a row. Cleared when full, so it stays small whatever the sheets hold.
const calendarDays = new Set<string>();
const CALENDAR_DAYS_KEPT = 4096;

function calendarDay(value: unknown): string {
  if (typeof value !== 'string') throw notCertain;
  if (calendarDays.has(value)) return value;
  if (!ISO_DAY.test(value)) throw notCertain;
  const day = new Date(`${value}T00:00:00Z`);
  if (Number.isNaN(day.getTime()) || day.toISOString().slice(0, 10) !== value) throw notCertain;
  if (calendarDays.size >= CALENDAR_DAYS_KEPT) calendarDays.clear();
  calendarDays.add(value);
  return value;
}

/**
 * What `createMeasurementInput.safeParse(body)` returns as its data, for a body an import built from one
 * row, when every field is valid beyond doubt; otherwise null, and the caller runs the schema, which then
 * words the problems as the API does. A sheet of 10,000 rows is thus checked by these few comparisons
 * instead of by the schema's general machinery, which costs more than writing the rows; the two agree on
 * every body this one accepts (tests/server/import-measurement-input.test.ts holds them to it).
 *
 * @param body the body of POST /api/measurements built from the row
 * @returns the parsed input, or null to let the schema decide
 */
export function certainMeasurementInput(body: Body): CreateMeasurementInput | null {
  try {
    const model = body.model === undefined ? 'michaelis-menten' : member<CreateMeasurementInput['model']>(body.model, MODELS);
    const ki = given(body.ki) ? parameter<ConcentrationUnitInput>(body.ki, CONCENTRATION_UNITS) : null;
    const hillCoefficient = given(body.hill) ? hill(body.hill) : null;
    // The schema's cross-field rules: Ki and the Hill coefficient belong to their models only.
    if ((ki !== null && model !== 'substrate-inhibition') || (hillCoefficient !== null && model !== 'hill')) return null;
    // In the schema's order of fields, as it builds its result.
    return {
      variantId: wholeNumber(body.variantId, Number.MAX_SAFE_INTEGER),
      substrate: text(body.substrate, 200, true)!,
      temperatureC: numberFrom(body.temperatureC, temperatureRangeCelsius.min, true, temperatureRangeCelsius.max),
      ph: numberFrom(body.ph, 0, true, 14),
      buffer: given(body.buffer) ? buffer(body.buffer) : null,
      ionicStrength: given(body.ionicStrength) ? concentration(body.ionicStrength, true) : null,
      metal: given(body.metal) ? metal(body.metal) : null,
      otherComponents: given(body.otherComponents) ? text(body.otherComponents, 500, false) : null,
      method: given(body.method) ? member<(typeof assayMethods)[number]>(body.method, METHODS) : null,
      detection: given(body.detection) ? text(body.detection, 200, false) : null,
      assayDate: calendarDay(body.assayDate),
      notes: given(body.notes) ? text(body.notes, 5000, false) : null,
      enzymeConcentration: given(body.enzymeConcentration) ? concentration(body.enzymeConcentration, false) : null,
      model,
      kcat: parameter<TurnoverUnitInput>(body.kcat, TURNOVER_UNITS),
      km: parameter<ConcentrationUnitInput>(body.km, CONCENTRATION_UNITS),
      kcatOverKm: given(body.kcatOverKm) ? parameter<SpecificityUnitInput>(body.kcatOverKm, SPECIFICITY_UNITS) : null,
      ki,
      hill: hillCoefficient,
      substrateRange: given(body.substrateRange) ? substrateRange(body.substrateRange) : null,
      replicateCount: given(body.replicateCount) ? wholeNumber(body.replicateCount, MAX_REPLICATES) : null,
      fittingMethod: given(body.fittingMethod) ? text(body.fittingMethod, 300, false) : null,
    };
  } catch (error) {
    if (error instanceof NotCertain) return null;
    throw error;
  }
}
