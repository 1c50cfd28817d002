import { z } from 'zod';
import { convertUnit, type ConcentrationUnit } from '../kinetics/units';
import type { MeasurementDto } from './measurement';
import { finiteNumber } from './finite-number';

/**
 * Units accepted at the edge. Every quantity is converted to SI-coherent units (M, M s⁻¹, s⁻¹, M⁻¹ s⁻¹, K)
 * before it is stored or compared; the unit a value was typed in is kept only for showing it again.
 * `uM` and the Greek `μM` (U+03BC) are accepted for `µM` (U+00B5 MICRO SIGN), because keyboards and
 * spreadsheets produce all three.
 */
export const concentrationUnits = ['M', 'mM', 'µM', 'uM', 'μM', 'nM'] as const;
export type ConcentrationUnitInput = (typeof concentrationUnits)[number];

const timeUnits = ['s', 'min'] as const;
type TimeUnit = (typeof timeUnits)[number];

/** Initial-rate units: concentration per time (`µM/min`). */
export const rateUnits = concentrationUnits.flatMap((concentration) =>
  timeUnits.map((time) => `${concentration}/${time}` as const),
);
export type RateUnitInput = (typeof rateUnits)[number];

/** First-order rate-constant units (kcat). */
export const turnoverUnits = ['1/s', 's⁻¹', '1/min', 'min⁻¹'] as const;
export type TurnoverUnitInput = (typeof turnoverUnits)[number];

/** Second-order rate-constant units (kcat/Km): `mM⁻¹ s⁻¹` or, in ASCII, `1/(mM*s)`. */
export const specificityUnits = concentrationUnits.flatMap((concentration) =>
  timeUnits.flatMap((time) => [`${concentration}⁻¹ ${time}⁻¹`, `1/(${concentration}*${time})`] as const),
);
export type SpecificityUnitInput = (typeof specificityUnits)[number];

// Looked up rather than parsed, so that only the listed spellings are ever converted.
const SPECIFICITY_PARTS = new Map<string, { concentration: ConcentrationUnitInput; time: TimeUnit }>(
  concentrationUnits.flatMap((concentration) =>
    timeUnits.flatMap((time) => [
      [`${concentration}⁻¹ ${time}⁻¹`, { concentration, time }] as const,
      [`1/(${concentration}*${time})`, { concentration, time }] as const,
    ]),
  ),
);

/** The unit labels the API returns beside SI values. */
export const siUnits = {
  concentration: 'M',
  rate: 'M s⁻¹',
  turnover: 's⁻¹',
  specificity: 'M⁻¹ s⁻¹',
} as const;

/** Kinetic models an assay can be fitted with. */
export const kineticModels = ['michaelis-menten', 'substrate-inhibition', 'hill'] as const;
export type KineticModelName = (typeof kineticModels)[number];

/** Fitted parameters of each model, which sets how many distinct substrate concentrations a fit needs. */
export const modelParameterCount: Record<KineticModelName, number> = {
  'michaelis-menten': 2,
  'substrate-inhibition': 3,
  hill: 3,
};

export const assayMethods = ['continuous', 'discontinuous'] as const;

/** Most rate points one assay may carry (a plate-reader export is far below this). */
export const maxAssayPoints = 10_000;

/** The canonical spelling of a concentration unit. */
export function canonicalConcentrationUnit(unit: ConcentrationUnitInput): ConcentrationUnit {
  return unit === 'uM' || unit === 'μM' ? 'µM' : unit;
}

/**
 * Converts a concentration to molar.
 *
 * @param value the concentration in `unit`
 * @param unit one of {@link concentrationUnits}
 * @throws {KineticsInputError} when `value` is not finite
 * @returns the concentration, M
 * @example toMolar(250, 'uM'); // 0.00025
 */
export function toMolar(value: number, unit: ConcentrationUnitInput): number {
  return convertUnit(value, canonicalConcentrationUnit(unit), 'M');
}

/**
 * Converts a molar concentration back to a unit for display.
 *
 * @param valueMolar the concentration, M
 * @param unit the wanted unit
 * @throws {KineticsInputError} when `valueMolar` is not finite
 * @returns the concentration in `unit`
 * @example fromMolar(0.00025, 'µM'); // 250
 */
export function fromMolar(valueMolar: number, unit: ConcentrationUnitInput): number {
  return convertUnit(valueMolar, 'M', canonicalConcentrationUnit(unit));
}

function splitRateUnit(unit: RateUnitInput): { concentration: ConcentrationUnitInput; time: TimeUnit } {
  const [concentration, time] = unit.split('/') as [ConcentrationUnitInput, TimeUnit];
  return { concentration, time };
}

/**
 * Converts an initial rate to M s⁻¹.
 *
 * @param value the rate in `unit` (concentration per time)
 * @param unit one of {@link rateUnits}
 * @throws {KineticsInputError} when `value` is not finite
 * @returns the rate, M s⁻¹
 * @example toMolarPerSecond(60, 'µM/min'); // 1e-6
 */
export function toMolarPerSecond(value: number, unit: RateUnitInput): number {
  const { concentration, time } = splitRateUnit(unit);
  const molarPerTime = toMolar(value, concentration);
  return time === 'min' ? convertUnit(molarPerTime, '1/min', '1/s') : molarPerTime;
}

/**
 * Converts an initial rate in M s⁻¹ back to a unit for display.
 *
 * @param valueMolarPerSecond the rate, M s⁻¹
 * @param unit the wanted unit
 * @throws {KineticsInputError} when the value is not finite
 * @returns the rate in `unit`
 * @example fromMolarPerSecond(1e-6, 'µM/min'); // 60
 */
export function fromMolarPerSecond(valueMolarPerSecond: number, unit: RateUnitInput): number {
  const { concentration, time } = splitRateUnit(unit);
  const perTime = time === 'min' ? convertUnit(valueMolarPerSecond, '1/s', '1/min') : valueMolarPerSecond;
  return fromMolar(perTime, concentration);
}

/**
 * Converts a first-order rate constant to s⁻¹.
 *
 * @param value kcat in `unit`
 * @param unit one of {@link turnoverUnits}
 * @throws {KineticsInputError} when `value` is not finite
 * @returns kcat, s⁻¹
 * @example toPerSecond(600, '1/min'); // 10
 */
export function toPerSecond(value: number, unit: TurnoverUnitInput): number {
  const perMinute = unit === '1/min' || unit === 'min⁻¹';
  return convertUnit(value, perMinute ? '1/min' : '1/s', '1/s');
}

/**
 * Converts a second-order rate constant (kcat/Km) to M⁻¹ s⁻¹: a value per concentration unit c is
 * multiplied by the number of c in one molar (1 mM⁻¹ s⁻¹ = 10³ M⁻¹ s⁻¹).
 *
 * @param value kcat/Km in `unit`
 * @param unit one of {@link specificityUnits}
 * @throws {KineticsInputError} when `value` is not finite
 * @returns kcat/Km, M⁻¹ s⁻¹
 * @example toPerMolarPerSecond(5, 'mM⁻¹ s⁻¹'); // 5000
 */
export function toPerMolarPerSecond(value: number, unit: SpecificityUnitInput): number {
  const { concentration, time } = SPECIFICITY_PARTS.get(unit)!;
  // k per c: multiply by the number of c in one molar, which convertUnit does as one exact power of ten.
  const perMolar = convertUnit(value, 'M', canonicalConcentrationUnit(concentration));
  return time === 'min' ? convertUnit(perMolar, '1/min', '1/s') : perMolar;
}

const positiveNumber = () => finiteNumber().positive('must be greater than 0');
const nonNegativeNumber = () => finiteNumber().nonnegative('must be at least 0');

const concentrationUnit = z.enum(concentrationUnits, { error: `must be one of ${concentrationUnits.join(', ')}` });
const rateUnit = z.enum(rateUnits as [RateUnitInput, ...RateUnitInput[]], {
  error: 'must be a concentration per time such as µM/min, mM/s or nM/min',
});
const turnoverUnit = z.enum(turnoverUnits, { error: `must be one of ${turnoverUnits.join(', ')}` });
const specificityUnit = z.enum(specificityUnits as [SpecificityUnitInput, ...SpecificityUnitInput[]], {
  error: 'must be a unit such as M⁻¹ s⁻¹, mM⁻¹ s⁻¹ or 1/(µM*min)',
});

const concentration = (value: () => z.ZodNumber) => z.object({ value: value(), unit: concentrationUnit });

const text = (maximum: number) =>
  z.string({ error: 'must be text' }).trim().max(maximum, `must be at most ${maximum} characters`);

const requiredText = (maximum: number) => text(maximum).min(1, 'is required');

/** An optional text field: empty or white space means "not given". */
const optionalText = (maximum: number) =>
  text(maximum)
    .nullable()
    .optional()
    .transform((value) => (value ? value : null));

const id = z.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1');

/** A calendar day `YYYY-MM-DD` that exists. */
const isoDate = z
  .string({ error: 'is required' })
  .regex(/^\d{4}-\d{2}-\d{2}$/, 'must be a date written YYYY-MM-DD')
  .refine((value) => {
    const date = new Date(`${value}T00:00:00Z`);
    return !Number.isNaN(date.getTime()) && date.toISOString().slice(0, 10) === value;
  }, 'is not a calendar date');

/** Lowest and highest assay temperature accepted, °C: below freezing with cosolvents up to hyperthermophiles. */
export const temperatureRangeCelsius = { min: -20, max: 150 } as const;

const temperatureC = finiteNumber()
  .min(temperatureRangeCelsius.min, `must be between ${temperatureRangeCelsius.min} and ${temperatureRangeCelsius.max} °C`)
  .max(temperatureRangeCelsius.max, `must be between ${temperatureRangeCelsius.min} and ${temperatureRangeCelsius.max} °C`);

const ph = finiteNumber().min(0, 'must be between 0 and 14').max(14, 'must be between 0 and 14');

/**
 * The assay conditions shared by fitted assays and directly entered measurements.
 *
 * - `buffer`: `{ name, concentration?: { value, unit } }` (e.g. `{ name: 'MES', concentration: { value: 50, unit: 'mM' } }`);
 *   one object so that a concentration never floats without its buffer;
 * - `metal`: `{ salt, concentration: { value, unit } }` for the metal salt added (e.g. ZnCl2);
 * - `ionicStrength`: `{ value, unit }`;
 * - `enzymeConcentration`: `{ value, unit }`, the total enzyme concentration [E]t.
 */
const conditionFields = {
  variantId: id,
  substrate: requiredText(200),
  temperatureC,
  ph,
  buffer: z
    .object({ name: requiredText(100), concentration: concentration(positiveNumber).nullable().optional() })
    .nullable()
    .optional(),
  ionicStrength: concentration(nonNegativeNumber).nullable().optional(),
  metal: z.object({ salt: requiredText(50), concentration: concentration(positiveNumber) }).nullable().optional(),
  otherComponents: optionalText(500),
  method: z.enum(assayMethods, { error: `must be one of ${assayMethods.join(', ')}` }).nullable().optional(),
  detection: optionalText(200),
  assayDate: isoDate,
  notes: optionalText(5000),
};

const model = z.enum(kineticModels, { error: `must be one of ${kineticModels.join(', ')}` });

const exclusionReason = optionalText(300);

const ratePointInput = z.object({
  s: nonNegativeNumber(),
  // A negative initial rate is not a rate; a point that came out below zero is excluded, not entered negative.
  v: nonNegativeNumber(),
  replicate: id.max(1000, 'must be at most 1000').default(1),
  excluded: z.boolean({ error: 'must be true or false' }).default(false),
  exclusionReason,
});

const NUMBER_WORDS = ['zero', 'one', 'two', 'three', 'four', 'five'];

/**
 * The fit's preconditions on the points it will use (excluded ones do not count), checked here so that
 * bad input is a 400 with a field message before any arithmetic runs; the wording follows the engine's.
 */
function checkFitPoints(
  points: readonly { x: number; y: number; excluded: boolean }[],
  parameterCount: number,
  nouns: { x: string; y: string },
  context: z.RefinementCtx,
): void {
  const used = points.filter((point) => !point.excluded);
  const required = parameterCount + 1;
  if (new Set(used.map((point) => point.x)).size < required) {
    context.addIssue({
      code: 'custom',
      path: ['points'],
      message: `must contain at least ${NUMBER_WORDS[required]} included points with distinct ${nouns.x}`,
    });
  }
  if (used.length > 0 && used.every((point) => point.y === 0)) {
    context.addIssue({ code: 'custom', path: ['points'], message: `must contain at least one included point with a non-zero ${nouns.y}` });
  }
}

function requireExclusionReasons(
  points: readonly { excluded: boolean; exclusionReason: string | null }[],
  context: z.RefinementCtx,
): void {
  points.forEach((point, index) => {
    if (point.excluded && !point.exclusionReason) {
      context.addIssue({
        code: 'custom',
        path: ['points', index, 'exclusionReason'],
        message: 'is required when a point is excluded',
      });
    }
  });
}

/**
 * A new assay with its raw initial rates; the server converts everything to SI units, fits the chosen model
 * to the points that are not excluded and stores the measurement. `points` are `{ s, v, replicate?,
 * excluded?, exclusionReason? }` in `sUnit` and `vUnit`.
 */
export const createAssayInput = z
  .object({
    ...conditionFields,
    enzymeConcentration: concentration(positiveNumber),
    points: z
      .array(ratePointInput, { error: 'must be a list of points' })
      .min(1, 'must contain at least one point')
      .max(maxAssayPoints, `must have at most ${maxAssayPoints} points`),
    sUnit: concentrationUnit,
    vUnit: rateUnit,
    model,
  })
  .superRefine((assay, context) => {
    requireExclusionReasons(assay.points, context);
    checkFitPoints(
      assay.points.map((point) => ({ x: point.s, y: point.v, excluded: point.excluded })),
      modelParameterCount[assay.model],
      { x: 'substrate concentrations', y: 'rate' },
      context,
    );
  });
export type CreateAssayInput = z.infer<typeof createAssayInput>;

/**
 * A refit of a stored assay: another model and/or changed exclusions (`points` names the stored points by
 * id). The current measurement is superseded by the new one, never deleted.
 */
export const refitAssayInput = z
  .object({
    version: id,
    model: model.optional(),
    points: z
      .array(
        z.object({
          id,
          excluded: z.boolean({ error: 'must be true or false' }),
          exclusionReason,
        }),
        { error: 'must be a list of points' },
      )
      .max(maxAssayPoints, `must have at most ${maxAssayPoints} points`)
      .default([]),
  })
  .superRefine((refit, context) => {
    if (refit.model === undefined && refit.points.length === 0) {
      context.addIssue({ code: 'custom', path: ['model'], message: 'give a model or point exclusions to change' });
    }
    requireExclusionReasons(refit.points, context);
    const seen = new Set<number>();
    refit.points.forEach((point, index) => {
      if (seen.has(point.id)) {
        context.addIssue({ code: 'custom', path: ['points', index, 'id'], message: `lists point ${point.id} twice` });
      }
      seen.add(point.id);
    });
  });
export type RefitAssayInput = z.infer<typeof refitAssayInput>;

const parameter = <U extends z.ZodType>(unit: U) =>
  z.object({
    value: positiveNumber(),
    // A value without an error cannot be weighted against replicates; zero would claim an exact value.
    se: finiteNumber().positive('must be greater than 0 (give the reported standard error)'),
    unit,
  });

/**
 * A measurement entered as reported values (no rate points): kcat and Km with standard errors and units,
 * optionally kcat/Km (otherwise derived from kcat and Km), Ki or the Hill coefficient where the model has
 * them, the substrate range tested, the number of replicates and the fitting method. The server creates the
 * assay row for its conditions.
 */
export const createMeasurementInput = z
  .object({
    ...conditionFields,
    enzymeConcentration: concentration(positiveNumber).nullable().optional(),
    model: model.default('michaelis-menten'),
    kcat: parameter(turnoverUnit),
    km: parameter(concentrationUnit),
    kcatOverKm: parameter(specificityUnit).nullable().optional(),
    ki: parameter(concentrationUnit).nullable().optional(),
    hill: z.object({ value: positiveNumber(), se: finiteNumber().positive('must be greater than 0') }).nullable().optional(),
    substrateRange: z
      .object({ min: nonNegativeNumber(), max: positiveNumber(), unit: concentrationUnit })
      .refine((range) => range.max > range.min, { message: 'max must be above min', path: ['max'] })
      .nullable()
      .optional(),
    replicateCount: id.max(1000, 'must be at most 1000').nullable().optional(),
    fittingMethod: optionalText(300),
  })
  .superRefine((measurement, context) => {
    if (measurement.ki && measurement.model !== 'substrate-inhibition') {
      context.addIssue({ code: 'custom', path: ['ki'], message: 'belongs to the substrate-inhibition model only' });
    }
    if (measurement.hill && measurement.model !== 'hill') {
      context.addIssue({ code: 'custom', path: ['hill'], message: 'belongs to the Hill model only' });
    }
  });
export type CreateMeasurementInput = z.infer<typeof createMeasurementInput>;

const pageFields = {
  page: z.coerce.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1').default(1),
  pageSize: z.coerce
    .number({ error: 'must be a number' })
    .int('must be a whole number')
    .min(1, 'must be at least 1')
    .max(500, 'must be at most 500')
    .default(50),
};

const queryId = z.coerce.number({ error: 'must be a number' }).int('must be a whole number').min(1, 'must be at least 1');

/** Query of GET /api/assays. */
export const assayListQuery = z.object({
  variantId: queryId.optional(),
  campaignId: queryId.optional(),
  ...pageFields,
});
export type AssayListQuery = z.infer<typeof assayListQuery>;

/** A value in SI units with its standard error and 95 % interval (null where unknown or unbounded). */
export interface UnitValue<U extends string> {
  value: number;
  se: number | null;
  ci95: [number, number] | null;
  unit: U;
}

/** One stored rate point: SI values and the values in the units it was entered in. */
export interface RatePointDto {
  id: number;
  replicate: number;
  excluded: boolean;
  exclusionReason: string | null;
  substrateMolar: number;
  rateMolarPerSecond: number;
  /** In the assay's `sUnit` and `vUnit`. */
  s: number;
  v: number;
}

/** The conditions of an assay as the API returns them (temperature in °C, concentrations in M). */
export interface AssayConditionsDto {
  substrate: string;
  temperatureC: number;
  ph: number;
  buffer: { name: string; concentration: { value: number; unit: 'M' } | null } | null;
  ionicStrength: { value: number; unit: 'M' } | null;
  metal: { salt: string; concentration: { value: number; unit: 'M' } | null } | null;
  otherComponents: string | null;
  /** [E]t in M and as entered. */
  enzymeConcentration: { value: number; unit: 'M'; entered: { value: number; unit: string } | null } | null;
  method: (typeof assayMethods)[number] | null;
  detection: string | null;
  assayDate: string;
}

/** An assay as the API returns it. */
export interface AssayDto {
  id: number;
  variant: { id: number; label: string; campaignId: number };
  conditions: AssayConditionsDto;
  /** Units the rate points were entered in (null for an assay made for an entered measurement). */
  sUnit: string | null;
  vUnit: string | null;
  replicateCount: number;
  notes: string | null;
  /** Number of stored rate points. */
  pointCount: number;
  /** Present on GET /api/assays/:id and on creation. */
  points?: RatePointDto[];
  /** Every measurement of the assay, the current one first (older ones are superseded refits). */
  measurements: MeasurementDto[];
  /** The measurement not superseded by a refit. */
  currentMeasurementId: number | null;
  createdById: number | null;
  createdAt: string;
  updatedAt: string;
  version: number;
}
